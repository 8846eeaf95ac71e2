/** Reversa's mark: a window opening in a board, with one corner turned back — the mount that can be undone. */
export function LogoMark({ size = 28 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" focusable="false">
      <rect width="32" height="32" rx="6" className="fill-accent" />
      <rect x="7" y="7" width="18" height="18" fill="none" stroke="#f6f2ea" strokeWidth="2.5" />
      <path d="M12 12h8v8" fill="none" stroke="#d9a441" strokeWidth="2.5" />
    </svg>
  );
}

export function Logo() {
  return (
    <span className="flex items-center gap-2">
      <LogoMark />
      <span className="text-lg font-bold tracking-tight text-ink">Reversa</span>
    </span>
  );
}
