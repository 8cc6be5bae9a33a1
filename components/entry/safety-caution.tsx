import type { HardwareConcern } from "@/lib/registry/safety";

/** The usual laser / high-power fibre-amplifier caution; it defers to local rules and licensed practice. */
export function SafetyCaution({ concern }: { concern: HardwareConcern }) {
  return (
    <aside role="note" aria-label="Laboratory safety" className="rounded-lg border border-ember-700/40 bg-ember-100 p-4 text-sm text-ember-700" data-testid="safety-caution">
      <p className="font-bold">Laboratory safety: this entry concerns laser or high-power optical hardware ({concern.matched.join(", ")}).</p>
      <p className="mt-1">
        Wavesieve screens equations; it says nothing about whether a setup is safe to build or run. Laser light and high-power
        fibre amplifiers can injure eyes and skin (often with invisible infrared beams), start fires, and fail
        suddenly (fibre fuse, back-reflections, stored pump energy). Before building or operating such a setup, follow your
        institution&apos;s laser safety rules and the applicable regulations and standards (for example IEC 60825), use the
        eyewear, enclosures and interlocks they require, and consult your laser safety officer. Where local rules require
        training, authorisation or licensed practice, they take precedence over anything shown here.
      </p>
    </aside>
  );
}
