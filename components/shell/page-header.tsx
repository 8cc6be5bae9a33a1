export function PageHeader({ title, lead }: { title: string; lead?: React.ReactNode }) {
  return (
    <div className="mb-6">
      <h1 className="text-2xl font-bold tracking-tight">{title}</h1>
      {lead ? <p className="mt-1 max-w-3xl text-abyss-500">{lead}</p> : null}
    </div>
  );
}

/** Shown where a role may not use a page: plain words, no data. */
export function NotAllowed({ needed }: { needed: string }) {
  return (
    <div role="alert" className="rounded-lg border border-ember-700/30 bg-ember-100 p-4 text-ember-700">
      This page needs the <strong>{needed}</strong> role. Ask an admin if you should have it.
    </div>
  );
}

/** For sections that are planned but not built yet: say so, show nothing invented. */
export function NotBuiltYet({ what }: { what: string }) {
  return (
    <div className="rounded-lg border border-dashed border-rule bg-panel p-6 text-abyss-500" data-testid="not-built">
      {what} is not built yet. Nothing is shown here until it is.
    </div>
  );
}
