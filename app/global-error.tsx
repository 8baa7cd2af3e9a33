'use client';

export default function GlobalError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <html lang="en">
      <body style={{ fontFamily: 'system-ui, sans-serif', background: '#f6f5f1', color: '#1f2428' }}>
        <div style={{ maxWidth: 420, margin: '15vh auto', textAlign: 'center' }}>
          <h1 style={{ fontSize: 18 }}>Needlemap is unavailable for a moment</h1>
          <p style={{ fontSize: 14, color: '#4a5157' }}>Nothing that was saved is lost. Try again shortly.</p>
          <button type="button" onClick={() => reset()} style={{ marginTop: 12, padding: '6px 14px' }}>Try again</button>
        </div>
      </body>
    </html>
  );
}
