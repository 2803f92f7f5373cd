/**
 * Lets the C allocator keep and reuse the memory a build frees, instead of handing it back to the kernel and
 * faulting it in again (docs/performance.md, "Fresh memory and the C allocator").
 *
 * glibc's malloc serves blocks from 128 KiB up with mmap and returns them with munmap, and gives back ("trims")
 * the top of its heaps once 128 KiB there are free. Both thresholds are dynamic: freeing an mmap'ed block larger
 * than the current threshold and at most DEFAULT_MMAP_THRESHOLD_MAX (32 MiB on 64-bit systems) raises the mmap
 * threshold to that block's size and the trim threshold to twice it (mallopt(3), "M_MMAP_THRESHOLD"; glibc
 * malloc/malloc.c, `__libc_free`). A build allocates and frees arrays of up to tens of MB and V8's compiler
 * threads allocate and free their working memory for every function they optimize; with the initial thresholds
 * every such cycle maps fresh pages, and on the machine this was measured on a fresh page costs ≈ 10 µs.
 *
 * So the binary allocates one block just under 32 MiB at start and drops it. It is never written, so it costs no
 * page, and the garbage collector frees it within the first milliseconds. Other C libraries ignore it.
 */

/** Just below DEFAULT_MMAP_THRESHOLD_MAX (32 MiB), malloc's chunk header and page rounding included. */
export const ALLOCATOR_PRIMER_BYTES = 30 * 2 ** 20;

/** Allocates the primer block and lets it go; see the module's comment. */
export function primeAllocator(): void {
  // allocUnsafeSlow: malloc, not calloc, and not from Node's buffer pool; never touched, so never faulted in
  Buffer.allocUnsafeSlow(ALLOCATOR_PRIMER_BYTES);
}
