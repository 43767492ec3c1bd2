export function Brand({ inverted = false }: { inverted?: boolean }) {
  return (
    <span className={`inline-flex items-center gap-2 text-xl font-bold ${inverted ? "text-white" : "text-ink"}`}>
      <svg aria-hidden="true" width="30" height="30" viewBox="0 0 64 64">
        <rect width="64" height="64" rx="12" fill={inverted ? "#ffffff" : "#12243a"} />
        <path d="M10 40 32 16l22 24H44L32 27 20 40Z" fill="#f2b01e" />
        <path d="M22 44h20v6H22z" fill={inverted ? "#12243a" : "#ffffff"} />
      </svg>
      Hangarleaf
    </span>
  );
}
