export default function NotFound() {
  return (
    <main className="grid min-h-[60vh] place-items-center">
      <div className="text-center">
        <div className="figures text-sm text-ink-faint">404</div>
        <h1 className="mt-1 text-lg font-semibold">Nothing here</h1>
        <p className="mt-1 text-sm text-ink-soft">It does not exist, or it was not shared with you.</p>
        <a href="/styles" className="mt-3 inline-block text-sm text-spruce-700 underline">Back to styles</a>
      </div>
    </main>
  );
}
