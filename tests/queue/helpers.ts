/** Shared set-up for the queue and jobs suites: demo users, family files, storing batches. */
import type { CurrentUser } from "@/lib/auth/current-user";
import type { Role } from "@/lib/auth/roles";

export async function usersByRole(): Promise<Record<Role, CurrentUser>> {
  const { User } = await import("@/models");
  const rows = await User.findAll();
  return Object.fromEntries(rows.map((u) => [u.role, { id: u.id, email: u.email, name: u.name, role: u.role }])) as Record<Role, CurrentUser>;
}

/**
 * A KdV family swept over `count` values of w (variants 0…count−1): u_t + 6 u u_x + u_xxx + w/(2(t+1)) u = 0.
 * Short to screen (well under a second per variant on the test machine).
 */
export function kdvSweep(id: string, count: number, offset = 0): string {
  const values = Array.from({ length: count }, (_, i) => (0.25 * (i + 1) + offset).toFixed(3));
  return `wavesieve: 1
families:
  - id: ${id}
    title: Shelf wave swept over the damping ${id}
    class: kdv
    parameters:
      w: { values: [${values.join(", ")}] }
    coefficients:
      p: "6"
      q: "1"
      r: "w/(2*(t + 1))"
    window: [0, 4]
`;
}

export async function storeYaml(user: CurrentUser, name: string, text: string) {
  const { validateFiles, storeBatch } = await import("@/lib/batches");
  const validations = validateFiles([{ name, text }]);
  const errors = validations.flatMap((v) => v.errors);
  if (errors.length) throw new Error(`fixture does not parse: ${JSON.stringify(errors)}`);
  return storeBatch(user, validations);
}

/** A stored report in the engine's JSON shape with only the verdict fields (for queue plumbing tests). */
export function verdictReport(engine: string, reducibility: string, painleve: string, agreement?: string): string {
  return JSON.stringify({ engine, reducibility: { verdict: reducibility }, painleve: { verdict: painleve }, ...(agreement ? { agreement } : {}) });
}

export async function waitFor<T>(probe: () => Promise<T | null | undefined | false>, timeoutMs: number, what: string, everyMs = 100): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value as T;
    if (Date.now() > deadline) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}
