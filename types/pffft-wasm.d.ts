// The parts of @echogarden/pffft-wasm (PFFFT compiled to WebAssembly by Emscripten) the engine calls; the
// package ships no types. Names and meanings from PFFFT's own header (src/pffft.h in the package).
declare module '@echogarden/pffft-wasm/simd' {
  export interface PffftModule {
    /** The module's memory as 32-bit floats; read it anew after an allocation (the memory may grow). */
    HEAPF32: Float32Array;
    /** A plan for transforms of size n (0 when PFFFT cannot do that size); kind 0 = PFFFT_REAL, 1 = PFFFT_COMPLEX. */
    _pffft_new_setup(n: number, kind: 0 | 1): number;
    _pffft_destroy_setup(setup: number): void;
    /** 16-byte aligned bytes of the module's memory (a pointer). */
    _pffft_aligned_malloc(bytes: number): number;
    _pffft_aligned_free(pointer: number): void;
    /**
     * Unscaled transform in the usual order (direction 0 = forward). `work`: N floats of scratch (2N for complex);
     * 0 puts them on the module's small stack, which PFFFT's header advises only below N = 16 384.
     */
    _pffft_transform_ordered(setup: number, input: number, output: number, work: number, direction: 0 | 1): void;
  }
  const createPffft: () => Promise<PffftModule>;
  export default createPffft;
}
