/**
 * Headroom's mark: a gauge arc whose last stretch (the headroom left before the limit) is
 * burnt orange, with the needle swinging toward it.
 */
export function HeadroomMark({ className = 'size-8' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden focusable="false">
      <rect width="32" height="32" rx="7" fill="#263042" />
      <path
        d="M6 22a10 10 0 0 1 16.5-7.6"
        fill="none"
        stroke="#f6f3ec"
        strokeWidth="2.4"
        strokeLinecap="round"
      />
      <path
        d="M23.2 15A10 10 0 0 1 26 22"
        fill="none"
        stroke="#d9622b"
        strokeWidth="2.4"
        strokeLinecap="round"
      />
      <path
        d="M9.2 18.4l-1.6-.8M12 14.6l-.9-1.5M16 13.2v-1.7"
        stroke="#f6f3ec"
        strokeOpacity=".55"
        strokeWidth="1.2"
        strokeLinecap="round"
      />
      <path d="M16 22l5.6-7.2" stroke="#d9622b" strokeWidth="2.4" strokeLinecap="round" />
      <circle cx="16" cy="22" r="2.3" fill="#f6f3ec" />
    </svg>
  );
}

export function Wordmark({ className }: { className?: string }) {
  return (
    <span className={`flex items-center gap-2 ${className ?? ''}`}>
      <HeadroomMark />
      <span className="text-xl font-bold tracking-tight">Headroom</span>
    </span>
  );
}
