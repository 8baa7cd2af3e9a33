/** Needlemap's mark: a stitch grid with one highlighted zone. */
export function NeedlemapMark({ className = '' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <rect width="32" height="32" rx="7" fill="#1a5148" />
      {[0, 1, 2, 3].map((r) =>
        [0, 1, 2, 3].map((c) => (
          <path
            key={`${r}-${c}`}
            d={`M${7 + c * 5} ${7 + r * 5} q1.5 3 3 0`}
            fill="none"
            stroke={r >= 1 && r <= 2 && c >= 1 ? '#e9c46a' : '#9fd3c7'}
            strokeWidth="1.6"
            strokeLinecap="round"
          />
        )),
      )}
    </svg>
  );
}
