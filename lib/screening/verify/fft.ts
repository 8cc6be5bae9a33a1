/**
 * Typed wrapper of fft.js (radix-4 complex FFT, MIT). fft.js ships declarations typed `any`;
 * this interface is what the engine relies on: interleaved [re0, im0, re1, im1, …] buffers,
 * forward X_k = Σ x_n e^{−2πikn/N}, inverse with e^{+2πikn/N} and the 1/N factor included.
 */
import FFTImpl from "fft.js";

export interface ComplexFft {
  size: number;
  forward(out: Float64Array, input: Float64Array): void;
  inverse(out: Float64Array, input: Float64Array): void;
}

interface FftJs {
  transform(out: Float64Array, data: Float64Array): void;
  inverseTransform(out: Float64Array, data: Float64Array): void;
}

export function complexFft(size: number): ComplexFft {
  const impl = new FFTImpl(size) as unknown as FftJs;
  return {
    size,
    forward: (out, input) => impl.transform(out, input),
    inverse: (out, input) => impl.inverseTransform(out, input),
  };
}
