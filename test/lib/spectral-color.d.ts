/**
 * Types for the parts of the npm package spectral-color that the tests and benchmarks use. The package ships
 * dist/index.d.ts, but its package.json "exports" map does not point to it, so TypeScript cannot find it.
 */
declare module "spectral-color" {
  export class Shape {
    readonly start: number;
    readonly end: number;
    readonly interval: number;
    constructor(start: number, end: number, interval: number);
    wavelengths(): number[];
  }
  export class SpectralDistribution<T extends number | number[] = number> {
    shape: Shape;
    samples: T[];
    constructor(config: { shape: Shape; samples: T[] });
    sampleAt(wavelength: number): T;
    multiply(factor: SpectralDistribution<number> | number): SpectralDistribution<T>;
    resample(shape: Shape): SpectralDistribution<T>;
  }
  export const cmfs: { CIE_1931_2DEG: SpectralDistribution<[number, number, number]> };
  export const illuminants: {
    D65: SpectralDistribution<number>;
    D50: SpectralDistribution<number>;
    E: SpectralDistribution<number>;
  };
  export function spragueInterpolator(x: number, samples: readonly number[]): number;
  export function spdToXyz(
    spec: SpectralDistribution<number>,
    cmfs?: SpectralDistribution<[number, number, number]>,
    emissive?: boolean,
    illuminant?: SpectralDistribution<number>,
  ): [number, number, number];
}
