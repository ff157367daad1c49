// The Plinthwise mark: a block on a plinth line, drawn, not borrowed.
export function BrandMark({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <rect x="7" y="8" width="18" height="12" rx="1.5" fill="currentColor" opacity="0.9" />
      <rect x="3" y="21" width="26" height="3" rx="1" fill="currentColor" opacity="0.55" />
      <path d="M3 27h26" stroke="currentColor" strokeWidth="1.5" strokeDasharray="2 2" opacity="0.5" />
    </svg>
  );
}

export function EmptyState({ title, children }: { title: string; children?: React.ReactNode }) {
  return (
    <div className="rounded-plinth border border-dashed border-grout-300 bg-grout-50 px-6 py-10 text-center">
      <p className="font-semibold text-basalt-700">{title}</p>
      {children ? <div className="mt-2 text-sm text-basalt-500">{children}</div> : null}
    </div>
  );
}
