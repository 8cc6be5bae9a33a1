/** Messages between the thread pool and an engine thread. */
export type ToThread = { type: "screen"; id: number; variantJson: string };

export type FromThread =
  | { type: "ready" }
  | { type: "stage"; id: number; stage: string }
  | { type: "done"; id: number; reportJson: string; engine: string; stage: string }
  | { type: "input-error"; id: number; message: string; stage: string }
  | { type: "engine-error"; id: number; message: string; stage: string };
