/** The word mark: three vessels in a row, the middle one stirred. */
export function Brand({ size = "md" }: { size?: "md" | "lg" }) {
  const h = size === "lg" ? 28 : 20;
  return (
    <span className="inline-flex items-center gap-2 font-semibold tracking-tight text-ink">
      <svg width={h * 1.8} height={h} viewBox="0 0 36 20" aria-hidden="true">
        <rect x="1" y="4" width="9" height="12" rx="2" fill="none" stroke="currentColor" strokeWidth="1.6" />
        <path d="M13 10h3" stroke="currentColor" strokeWidth="1.6" />
        <rect x="17" y="6" width="18" height="8" rx="4" fill="#136f67" />
      </svg>
      <span className={size === "lg" ? "text-2xl" : "text-base"}>Seriatim</span>
    </span>
  );
}
