import { LogoMark } from "@/components/shell/logo-mark";

/** The centred card of the signed-out pages. */
export function AuthCard({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center px-4 py-10">
      <div className="w-full max-w-sm">
        <div className="mb-6 flex items-center gap-3">
          <LogoMark size={40} />
          <div>
            <div className="text-xl font-bold tracking-tight">Wavesieve</div>
            <div className="text-sm text-abyss-500">Which wave models are exactly solvable?</div>
          </div>
        </div>
        <div className="rounded-xl border border-rule bg-panel p-6 shadow-sm">
          <h1 className="mb-4 text-lg font-bold">{title}</h1>
          {children}
        </div>
      </div>
    </main>
  );
}
