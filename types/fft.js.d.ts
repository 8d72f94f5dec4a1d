/** fft.js 4.0 ships no types. */
declare module 'fft.js' {
  export default class FFT {
    constructor(size: number);
    readonly size: number;
    createComplexArray(): number[];
    realTransform(out: number[] | Float64Array, input: ArrayLike<number>): void;
    completeSpectrum(out: number[] | Float64Array): void;
    transform(out: number[] | Float64Array, data: ArrayLike<number>): void;
    inverseTransform(out: number[] | Float64Array, data: ArrayLike<number>): void;
  }
}
