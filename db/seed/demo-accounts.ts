// The invented demo: a small consultancy, its members and its first study. Plain data, shared
// by the seed, the sign-in page's demo panel and the browser tests.
import type { TeamRole } from "@/lib/access/roles";

export const demoPassword = "fernhill-demo-2026";
export const demoTeam = { slug: "fernhill-acoustics-demo", name: "Fernhill Acoustics (demo)" };

export const demoMembers: { name: string; email: string; role: TeamRole; job: string }[] = [
  { name: "Ines Okafor", email: "ines@fernhill.test", role: "owner", job: "engineer who runs the study" },
  { name: "Tomas Lindgren", email: "tomas@fernhill.test", role: "editor", job: "colleague who tries variants" },
  { name: "Priya Raman", email: "priya@fernhill.test", role: "reviewer", job: "reviewer who signs off runs" },
  { name: "Owen Marsh", email: "owen@fernhill.test", role: "viewer", job: "client's planner, read-only" },
];

export const demoStudy = {
  title: "Alder Row: roadside noise barrier",
  siteReference: "FH-2026-014",
  description:
    "Cross-section from the near lane of Fernhill Road to the west façades of Alder Row. Does a 3 m reflective timber barrier do enough for the garden and the first-floor windows, or is the 4 m absorptive design worth its cost? Invented demo data.",
};

