/**
 * The Setwell mark: a jar shoulder holding a set surface (the wave) — the moment the
 * preserve sets well. Drawn inline so it inherits colour and needs no request.
 */
export function SetwellMark({ size = 32, className = '' }: { size?: number; className?: string }) {
  return (
    <svg width={size} height={size} viewBox="0 0 48 48" role="img" aria-label="Setwell" className={className}>
      <rect x="14" y="4" width="20" height="6" rx="2" fill="#d9a82e" />
      <path d="M12 14c0-2 1.5-3 3.5-3h17c2 0 3.5 1 3.5 3v26c0 2.5-2 4-4.5 4h-15C14 44 12 42.5 12 40z" fill="#6b3459" />
      <path d="M12 24c4 2.5 8 2.5 12 0s8-2.5 12 0v16c0 2.5-2 4-4.5 4h-15C14 44 12 42.5 12 40z" fill="#9f6389" />
      <path d="M12 24c4 2.5 8 2.5 12 0s8-2.5 12 0" fill="none" stroke="#f9edc6" strokeWidth="1.6" strokeLinecap="round" />
    </svg>
  );
}

export function SetwellWordmark() {
  return (
    <span className="inline-flex items-center gap-2">
      <SetwellMark size={30} />
      <span className="font-display text-xl font-semibold tracking-tight text-damson-900">Setwell</span>
    </span>
  );
}
