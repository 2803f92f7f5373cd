/**
 * Functions whose result must not depend on the JavaScript engine. ECMAScript leaves the accuracy of
 * `Math.atan2` and `Math.pow` to each engine ("implementation-approximated", ECMA-262 §21.3.2), and engines do
 * differ: Node 20 and a current Chromium disagree in the last bit for about one `atan2` in five and one `x ** 3`
 * in ten. The structural re-check uses both, and the preview page must write the same files as the command line
 * (DESIGN §13), so they are computed here with IEEE-754 arithmetic alone, which every engine rounds alike.
 *
 * `atan2` is a port of fdlibm 5.3's e_atan2.c and s_atan.c (Sun Microsystems, 1993; the freely
 * distributable C math library that V8's own `ieee754::atan2` ports too).
 */

const view = new DataView(new ArrayBuffer(8));

/** The high and low 32-bit words of a double (IEEE-754 binary64). */
function words(x: number): [hi: number, lo: number] {
  view.setFloat64(0, x);
  return [view.getInt32(0), view.getUint32(4)];
}

const ATAN_HI = [4.63647609000806093515e-1, 7.85398163397448278999e-1, 9.82793723247329054082e-1, 1.5707963267948965580e0];
const ATAN_LO = [2.26987774529616870924e-17, 3.06161699786838301793e-17, 1.39033110312309984516e-17, 6.12323399573676603587e-17];
const AT = [
  3.33333333333329318027e-1, -1.99999999998764832476e-1, 1.42857142725034663711e-1, -1.1111110405462355788e-1, 9.09088713343650656196e-2,
  -7.69187620504482999495e-2, 6.66107313738753120669e-2, -5.83357013379057348645e-2, 4.97687799461593236017e-2, -3.6531572744216915527e-2,
  1.62858201153657823623e-2,
];

/** Arc tangent (radians, −π/2 … π/2): fdlibm s_atan.c — argument reduction to |x| < 7/16 and a polynomial. */
export function atan(x: number): number {
  const [hx] = words(x);
  const ix = hx & 0x7fffffff;
  if (ix >= 0x44100000) {
    if (x !== x) return x + x; // NaN
    return hx > 0 ? ATAN_HI[3] + ATAN_LO[3] : -ATAN_HI[3] - ATAN_LO[3];
  }
  let id: number;
  if (ix < 0x3fdc0000) {
    if (ix < 0x3e400000) return x; // |x| < 2^-27: atan x = x to the last bit
    id = -1;
  } else {
    x = Math.abs(x);
    if (ix < 0x3ff30000) {
      if (ix < 0x3fe60000) {
        id = 0;
        x = (2 * x - 1) / (2 + x);
      } else {
        id = 1;
        x = (x - 1) / (x + 1);
      }
    } else if (ix < 0x40038000) {
      id = 2;
      x = (x - 1.5) / (1 + 1.5 * x);
    } else {
      id = 3;
      x = -1 / x;
    }
  }
  const z = x * x;
  const w = z * z;
  const s1 = z * (AT[0] + w * (AT[2] + w * (AT[4] + w * (AT[6] + w * (AT[8] + w * AT[10])))));
  const s2 = w * (AT[1] + w * (AT[3] + w * (AT[5] + w * (AT[7] + w * AT[9]))));
  if (id < 0) return x - x * (s1 + s2);
  const r = ATAN_HI[id] - (x * (s1 + s2) - ATAN_LO[id] - x);
  return hx < 0 ? -r : r;
}

const PI_O_4 = 7.853981633974482790e-1;
const PI_O_2 = 1.570796326794896558e0;
const PI = 3.141592653589793116e0;
const PI_LO = 1.2246467991473531772e-16;

/** atan2(y, x), radians in −π … π, the angle of the point (x, y): fdlibm e_atan2.c. */
export function atan2(y: number, x: number): number {
  if (x !== x || y !== y) return x + y;
  const [hx, lx] = words(x);
  const [hy, ly] = words(y);
  const ix = hx & 0x7fffffff;
  const iy = hy & 0x7fffffff;
  if (x === 1) return atan(y);
  let m = ((hy >>> 31) & 1) | ((hx >>> 30) & 2); // 2·sign(x) + sign(y)
  if ((iy | ly) === 0) return m === 2 ? PI : m === 3 ? -PI : y; // y = ±0
  if ((ix | lx) === 0) return hy < 0 ? -PI_O_2 : PI_O_2; // x = ±0
  if (ix === 0x7ff00000) {
    if (iy === 0x7ff00000) return [PI_O_4, -PI_O_4, 3 * PI_O_4, -3 * PI_O_4][m];
    return [0, -0, PI, -PI][m];
  }
  if (iy === 0x7ff00000) return hy < 0 ? -PI_O_2 : PI_O_2;
  const k = (iy - ix) >> 20;
  let z: number;
  if (k > 60) {
    z = PI_O_2 + 0.5 * PI_LO; // |y/x| > 2^60
    m &= 1;
  } else if (hx < 0 && k < -60) z = 0; // |y|/x < −2^60
  else z = atan(Math.abs(y / x));
  switch (m) {
    case 0:
      return z;
    case 1:
      return -z;
    case 2:
      return PI - (z - PI_LO);
    default:
      return z - PI_LO - PI;
  }
}

/**
 * x^p: for a whole p from 0 to 64 by multiplications (square and multiply), the same bits in every engine;
 * otherwise `Math.pow`, whose last bit may differ between engines.
 */
export function powPortable(x: number, p: number): number {
  if (!Number.isInteger(p) || p < 0 || p > 64) return Math.pow(x, p);
  let result = 1;
  let base = x;
  let n = p;
  while (n > 0) {
    if (n & 1) result *= base;
    n >>= 1;
    if (n > 0) base *= base;
  }
  return result;
}

/**
 * √(x² + y² [+ z²]) without overflow: each value divided by the largest, the squares summed with Kahan's
 * compensation, the root times the largest — V8's algorithm for `Math.hypot` (the same bits as Node), in IEEE
 * arithmetic alone (SpiderMonkey's `Math.hypot` rounds otherwise). Infinity wins over NaN (ECMA-262 §21.3.2.18).
 */
export function hypot(x: number, y: number, z?: number): number {
  const a = Math.abs(x);
  const b = Math.abs(y);
  const c = z === undefined ? 0 : Math.abs(z);
  if (a === Infinity || b === Infinity || c === Infinity) return Infinity;
  if (a !== a || b !== b || c !== c) return NaN;
  const max = a > b ? (a > c ? a : c) : b > c ? b : c;
  if (max === 0) return 0;
  const p = a / max;
  const q = b / max;
  // Kahan's sum of p², q², r², as V8 adds them (for two values the compensation is exactly 0)
  let sum = p * p;
  let summand = q * q;
  let next = sum + summand;
  let compensation = next - sum - summand;
  sum = next;
  if (z === undefined) return Math.sqrt(sum) * max;
  const r = c / max;
  summand = r * r - compensation;
  next = sum + summand;
  sum = next;
  return Math.sqrt(sum) * max;
}
