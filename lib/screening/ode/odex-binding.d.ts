// Types for the subset of odex 2.0.4 that Wavesieve uses (see odex-binding.js for why this file exists).
export type OdexDerivative = (x: number, y: number[]) => number[];
export type OdexOutputFunction = (
  nr: number,
  xOld: number,
  x: number,
  y: number[],
  dense?: (component: number, x: number) => number,
) => boolean | void;
export interface OdexSolveResult {
  y: number[];
  /** 0 = converged, 1 = maxSteps exceeded, 2 = early return requested by the output function. */
  outcome: number;
  nStep: number;
  /** The requested end point echoed back — NOT where the integration stopped. */
  xEnd: number;
  nAccept: number;
  nReject: number;
  nEval: number;
}
export declare class Solver {
  constructor(n: number);
  n: number;
  maxSteps: number;
  initialStepSize: number;
  maxStepSize: number;
  denseOutput: boolean;
  relativeTolerance: number | number[];
  absoluteTolerance: number | number[];
  solve(f: OdexDerivative, x: number, y0: number[], xEnd: number, solOut?: OdexOutputFunction): OdexSolveResult;
}
