/** Test helper: an RFC 4180 CSV reader, independent of the summary writer in cli/batch/summary.ts. */

/**
 * A reader for RFC 4180 CSV (RFC 4180 §2: fields separated by commas, records by CRLF, a field in double
 * quotes may hold commas, CR/LF and doubled quotes). Written here, independent of the writer.
 */
export function readCsv(text: string): string[][] {
  const records: string[][] = [];
  let field = '';
  let record: string[] = [];
  let k = 0;
  let quoted = false;
  while (k < text.length) {
    const ch = text[k];
    if (quoted) {
      if (ch === '"' && text[k + 1] === '"') {
        field += '"';
        k += 2;
      } else if (ch === '"') {
        quoted = false;
        k++;
      } else {
        field += ch;
        k++;
      }
    } else if (ch === '"' && field === '') {
      quoted = true;
      k++;
    } else if (ch === ',') {
      record.push(field);
      field = '';
      k++;
    } else if (ch === '\r' && text[k + 1] === '\n') {
      record.push(field);
      records.push(record);
      record = [];
      field = '';
      k += 2;
    } else {
      field += ch;
      k++;
    }
  }
  if (field !== '' || record.length > 0) {
    record.push(field);
    records.push(record);
  }
  return records;
}
