/** A titled section of the entry page, and the note shown where an older engine computed nothing. */
export function Section({ id, title, children, aside }: { id: string; title: string; children: React.ReactNode; aside?: React.ReactNode }) {
  return (
    <section aria-labelledby={`${id}-h`} className="space-y-3" id={id}>
      <div className="flex flex-wrap items-baseline justify-between gap-2 border-b border-rule pb-1">
        <h2 id={`${id}-h`} className="text-lg font-bold">{title}</h2>
        {aside}
      </div>
      {children}
    </section>
  );
}

export function NotComputed({ what, engine }: { what: string; engine: string }) {
  return (
    <p className="rounded-md border border-dashed border-rule bg-panel px-3 py-2 text-sm text-abyss-500" data-testid="not-computed">
      {what}: not computed by this engine version ({engine}). A re-screen with a newer engine adds it.
    </p>
  );
}

export function Invalid({ what, problem }: { what: string; problem: string }) {
  return <p className="rounded-md bg-coral-100 px-3 py-2 text-sm text-coral-700">{what}: the stored data cannot be read ({problem}).</p>;
}

export function KeyValues({ items }: { items: [string, React.ReactNode][] }) {
  return (
    <dl className="grid grid-cols-[minmax(0,max-content)_minmax(0,1fr)] gap-x-4 gap-y-1 text-sm">
      {items.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="text-abyss-500">{k}</dt>
          <dd className="min-w-0 [overflow-wrap:anywhere]">{v}</dd>
        </div>
      ))}
    </dl>
  );
}
