// ode45-cash-karp ships no types; this covers the part the engine's wrapper uses.
declare module 'ode45-cash-karp' {
  type Derivative = (dydt: Float64Array, y: Float64Array, t: number) => void;
  interface Integrator {
    y: Float64Array;
    t: number;
    dt: number;
    tol: number;
    dtMaxMag: number | undefined;
    dtMinMag: number;
    /** Derivative at the start of the last step (the first Runge-Kutta stage). */
    _k1: Float64Array;
    step(tLimit?: number): boolean;
  }
  interface Options {
    tol?: number;
    dtMinMag?: number;
    dtMaxMag?: number;
    maxIncreaseFactor?: number;
    maxDecreaseFactor?: number;
    verbose?: boolean;
  }
  function createIntegrator(y0: Float64Array, deriv: Derivative, t0: number, dt0: number, options?: Options): Integrator;
  export default createIntegrator;
}
