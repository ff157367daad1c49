import { CAUTIONS, CAUTIONS_TITLE } from "@/modules/platform/cautions";

export function Cautions() {
  return (
    <aside className="rounded-plinth border-l-4 border-ochre-500 bg-ochre-100 px-4 py-3 text-xs text-basalt-800" data-testid="cautions" aria-label="Cautions">
      <p className="font-semibold uppercase tracking-wide text-ochre-700">{CAUTIONS_TITLE}</p>
      <ul className="mt-1 list-disc space-y-0.5 pl-4">
        {CAUTIONS.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>
    </aside>
  );
}
