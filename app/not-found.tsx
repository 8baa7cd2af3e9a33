import { connection } from 'next/server';

export default async function NotFound() {
  // Rendered per request, not at build time: the page's scripts need the nonce of the request's
  // Content-Security-Policy (proxy.ts), which a page built ahead of time cannot carry.
  await connection();
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
