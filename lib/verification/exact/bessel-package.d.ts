// Types for the `bessel` package (pure-JS Bessel functions, integer order; it ships no declarations).
declare module "bessel" {
  interface BesselFunctions {
    /** J_n(x), first kind, integer order n >= 0. */
    besselj(x: number, n: number): number;
    /** Y_n(x), second kind, integer order n >= 0, x > 0. */
    bessely(x: number, n: number): number;
    /** I_n(x), modified first kind. */
    besseli(x: number, n: number): number;
    /** K_n(x), modified second kind, x > 0. */
    besselk(x: number, n: number): number;
    version: string;
  }
  const BESSEL: BesselFunctions;
  export default BESSEL;
}
