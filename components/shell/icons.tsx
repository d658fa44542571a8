/** Line icons drawn for Riseline (24 px grid, currentColor). */
const common = { width: 24, height: 24, viewBox: "0 0 24 24", fill: "none", stroke: "currentColor", strokeWidth: 2, strokeLinecap: "round" as const, strokeLinejoin: "round" as const, "aria-hidden": true };

export type IconName = "home" | "tests" | "new" | "review" | "casebook" | "tools" | "shop" | "customers" | "mail" | "profile" | "more" | "signout" | "close";

export function Icon({ name, className }: { name: IconName; className?: string }) {
  switch (name) {
    case "home":
      return <svg {...common} className={className}><path d="M3 11 12 4l9 7" /><path d="M5 10v10h14V10" /><path d="M10 20v-5h4v5" /></svg>;
    case "tests":
      return <svg {...common} className={className}><path d="M4 4v16h16" /><path d="M6 7c2 7 4 9 6 9s4-1 8-6" /></svg>;
    case "new":
      return <svg {...common} className={className}><path d="M12 5v14M5 12h14" /></svg>;
    case "review":
      return <svg {...common} className={className}><rect x="4" y="3" width="16" height="18" rx="2" /><path d="m8 12 3 3 5-6" /></svg>;
    case "casebook":
      return <svg {...common} className={className}><path d="M5 4h10a4 4 0 0 1 4 4v12H9a4 4 0 0 1-4-4z" /><path d="M9 8h6M9 12h4" /></svg>;
    case "tools":
      return <svg {...common} className={className}><circle cx="12" cy="12" r="8" /><path d="M12 12 16 8" /><path d="M12 4v2M4 12h2M18 12h2" /></svg>;
    case "shop":
      return <svg {...common} className={className}><circle cx="9" cy="8" r="3" /><path d="M3 20c0-3 3-5 6-5s6 2 6 5" /><circle cx="17" cy="9" r="2.5" /><path d="M16 15c3 0 5 2 5 4.5" /></svg>;
    case "customers":
      return <svg {...common} className={className}><path d="M4 20V9l8-5 8 5v11" /><path d="M9 20v-6h6v6" /></svg>;
    case "mail":
      return <svg {...common} className={className}><rect x="3" y="5" width="18" height="14" rx="2" /><path d="m3 7 9 6 9-6" /></svg>;
    case "profile":
      return <svg {...common} className={className}><path d="M5 4v16M12 4v16M19 4v16" /><circle cx="5" cy="9" r="2" /><circle cx="12" cy="15" r="2" /><circle cx="19" cy="7" r="2" /></svg>;
    case "more":
      return <svg {...common} className={className}><path d="M4 7h16M4 12h16M4 17h16" /></svg>;
    case "signout":
      return <svg {...common} className={className}><path d="M14 4h5v16h-5" /><path d="M10 8l-4 4 4 4M6 12h10" /></svg>;
    case "close":
      return <svg {...common} className={className}><path d="M6 6l12 12M18 6 6 18" /></svg>;
  }
}
