// The Fluxfolio mark: a ring (the charged particle's orbit) threaded by a thin flux line, and the word mark.
// Drawn inline as SVG so it needs no image request.
export function LogoMark({ className = 'size-7' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden>
      <ellipse cx="16" cy="17" rx="12" ry="6.5" fill="none" stroke="#4338ca" strokeWidth="2.5" />
      <line x1="16" y1="3" x2="16" y2="29" stroke="#f59e0b" strokeWidth="2.5" strokeLinecap="round" />
      <path d="M4 17a12 6.5 0 0 0 24 0" fill="none" stroke="#4338ca" strokeWidth="2.5" />
    </svg>
  );
}

export function Wordmark() {
  return (
    <span className="flex items-center gap-2">
      <LogoMark />
      <span className="text-lg font-semibold tracking-tight text-slate-900">
        Flux<span className="text-flux-700">folio</span>
      </span>
    </span>
  );
}
