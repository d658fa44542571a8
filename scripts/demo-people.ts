import type { Role } from "@/lib/permissions";

/** An invented company and crew for the local demo. Any likeness to a real business is chance. */
export const DEMO_COMPANY = { name: "Larkspur Climate Works", slug: "larkspur-climate-works" };

export const DEMO_PEOPLE: { role: Role; name: string; email: string; password: string }[] = [
  { role: "owner", name: "Marisol Quint", email: "owner@larkspur.example", password: "demo-owner-2026" },
  { role: "lead", name: "Desmond Achterberg", email: "lead@larkspur.example", password: "demo-lead-2026" },
  { role: "technician", name: "Priya Talwar", email: "priya@larkspur.example", password: "demo-tech-2026" },
  { role: "technician", name: "Jonah Whitlow", email: "jonah@larkspur.example", password: "demo-tech-2026" },
  { role: "trainer", name: "Ingrid Solvang", email: "trainer@larkspur.example", password: "demo-trainer-2026" },
  { role: "apprentice", name: "Theo Mbeki-Lund", email: "apprentice@larkspur.example", password: "demo-apprentice-2026" },
];
