// Re-export of the odex package (Hairer–Wanner ODEX, GBS extrapolation; BSD-2).
// Why a .js shim: odex's package.json "main" points at src/odex.js next to src/odex.ts, so tsc
// would resolve `import "odex"` to that .ts source and type-check it (it is not strict-clean).
// Importing this file instead makes tsc read the sibling odex-binding.d.ts, while every runtime
// (vitest, tsx, the Next bundler) loads the real package.
export { Solver } from "odex";
