/** Special functions for the exact solutions: complete elliptic integrals and Jacobi functions. */
export { ellipticK, ellipticE, jacobiElliptic, jacobiEllipticJet } from "./elliptic";
export type { JacobiValues } from "./elliptic";
