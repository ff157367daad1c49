export default function Loading() {
  return (
    <div className="animate-pulse space-y-4" aria-busy="true" aria-label="Loading">
      <div className="h-6 w-64 rounded-plinth bg-grout-200" />
      <div className="h-40 rounded-plinth bg-grout-100" />
    </div>
  );
}
