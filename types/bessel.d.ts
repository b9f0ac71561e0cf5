/** The `bessel` package (SheetJS) ships no types: Bessel functions of integer order n. */
declare module 'bessel' {
  export function besseli(x: number, n: number): number;
  export function besselj(x: number, n: number): number;
  export function besselk(x: number, n: number): number;
  export function bessely(x: number, n: number): number;
}
