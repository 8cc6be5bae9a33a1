/** ODE integration for the map functions (odex wrapper with blow-up and finiteness guards). */
export { integrateOnGrid, uniformGrid, refineZero } from "./integrate";
export type { OdeSystem, OdeOptions, OdeResult, OdeStats, OdeFailure } from "./integrate";
