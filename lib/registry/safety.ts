/**
 * The one rule that decides whether an entry concerns laboratory laser or high-power optical
 * hardware, so the entry page shows the safety caution. Pure (usable anywhere).
 *
 * Rule: the entry's tags, title or notes mention a laser, a fibre/fiber or optical amplifier
 * (or EDFA/YDFA/TDFA, the usual doped-fibre amplifier abbreviations), a bare "amplifier",
 * "high power"/"high-power", or pump power in watts. Matching is case-insensitive on whole words;
 * a false positive only shows a caution, a false negative would hide one, so the rule is broad.
 */

const PATTERNS: { label: string; pattern: RegExp }[] = [
  { label: "laser", pattern: /\blas(?:er|ers|ing)\b/i },
  { label: "fibre amplifier", pattern: /\bfib(?:re|er)[\s-]*(?:amplifiers?|amps?|lasers?)\b/i },
  { label: "optical amplifier", pattern: /\b(?:optical|doped)[\s-]*amplifiers?\b/i },
  { label: "doped-fibre amplifier", pattern: /\b(?:edfa|ydfa|tdfa)s?\b/i },
  { label: "amplifier", pattern: /\bamplifi(?:er|ers|cation)\b/i },
  { label: "high power", pattern: /\bhigh[\s-]*power\b/i },
  { label: "pump power", pattern: /\bpump(?:ed|ing)?[\s-]*(?:power|laser|diode)s?\b|\b\d+(?:\.\d+)?\s*(?:k?w|watts?)\b/i },
];

export interface HardwareSubject {
  title: string;
  notes?: string;
  tags: readonly string[];
}

export interface HardwareConcern {
  /** What matched, e.g. ["laser", "fibre amplifier"], for the caution's first line. */
  matched: string[];
}

export function hardwareConcern(subject: HardwareSubject): HardwareConcern | null {
  const text = [subject.title, subject.notes ?? "", ...subject.tags.map((t) => t.replace(/[-_.]/g, " "))].join("\n");
  let matched = PATTERNS.filter((p) => p.pattern.test(text)).map((p) => p.label);
  // "amplifier" alone adds nothing when a more specific amplifier kind matched.
  if (matched.some((m) => m.endsWith("amplifier") && m !== "amplifier")) matched = matched.filter((m) => m !== "amplifier");
  return matched.length ? { matched } : null;
}
