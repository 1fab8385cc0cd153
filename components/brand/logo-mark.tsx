/** The Loxodrome mark: a sphere crossed by the spiral a steady heading traces on it. */
export function LogoMark({ className, title = "Loxodrome" }: { className?: string; title?: string }) {
  return (
    <svg
      viewBox="0 0 32 32"
      className={className}
      fill="none"
      {...(title ? { role: "img", "aria-label": title } : { "aria-hidden": true })}
    >
      <circle cx="16" cy="16" r="13" className="stroke-lox-600 dark:stroke-lox-300" strokeWidth="1.6" />
      <path
        d="M21.1 26.9M19.3 27.5L19.1 27.6L19.6 27.3L20.6 26.9L21.6 26.5L22.4 26.1L22.8 25.9M15.7 28.0L15.5 27.9L15.7 27.8L16.0 27.6L16.5 27.2L17.2 26.8L18.1 26.4L19.0 25.9L20.0 25.4L21.0 24.8L22.0 24.3L23.0 23.8L23.9 23.3L24.7 22.8L25.4 22.4L25.9 22.0L26.4 21.7L26.7 21.4L26.8 21.2M6.8 23.7L6.7 23.5L6.6 23.3L6.7 23.1L6.9 22.8L7.1 22.4L7.5 22.0L8.0 21.6L8.5 21.2L9.1 20.7L9.8 20.2L10.6 19.6L11.4 19.0L12.3 18.5L13.2 17.9L14.1 17.2L15.0 16.6L16.0 16.0L17.0 15.4L17.9 14.8L18.8 14.1L19.7 13.5L20.6 13.0L21.4 12.4L22.2 11.8L22.9 11.3L23.5 10.8L24.0 10.4L24.5 10.0L24.9 9.6L25.1 9.2L25.3 8.9L25.4 8.7L25.3 8.5L25.2 8.3M5.2 10.8L5.3 10.6L5.6 10.3L6.1 10.0L6.6 9.6L7.3 9.2L8.1 8.7L9.0 8.2L10.0 7.7L11.0 7.2L12.0 6.6L13.0 6.1L13.9 5.6L14.8 5.2L15.5 4.8L16.0 4.4L16.3 4.2L16.5 4.1L16.3 4.0M9.2 6.1L9.6 5.9L10.4 5.5L11.4 5.1L12.4 4.7L12.9 4.4L12.7 4.5M10.9 5.1"
        className="stroke-brass-500"
        strokeWidth="1.4"
        strokeLinecap="round"
        strokeLinejoin="round"
      />
      <circle cx="16" cy="4.6" r="1.6" className="fill-lox-600 dark:fill-lox-300" />
    </svg>
  );
}

export function Wordmark({ className }: { className?: string }) {
  return (
    <span className={"inline-flex items-center gap-2 font-display font-semibold tracking-tight " + (className ?? "")}>
      <LogoMark className="h-7 w-7" title="" />
      <span>Loxodrome</span>
    </span>
  );
}
