import type { Role } from "@/entities";

// Our invented scenario: Fenwick Analog Works builds bench instruments; Larkspur Instruments is a partner team.
export const DEMO_PASSWORD = "assay-demo";

export const demoTeams = [
  { slug: "fenwick", name: "Fenwick Analog Works" },
  { slug: "larkspur", name: "Larkspur Instruments" },
];

export const demoPeople: { email: string; name: string; memberships: { team: string; role: Role }[] }[] = [
  { email: "iris.calder@fenwick.test", name: "Iris Calder", memberships: [{ team: "fenwick", role: "admin" }] },
  {
    email: "tomas.reyes@fenwick.test",
    name: "Tomas Reyes",
    memberships: [
      { team: "fenwick", role: "maintainer" },
      { team: "larkspur", role: "viewer" },
    ],
  },
  { email: "nadia.okafor@fenwick.test", name: "Nadia Okafor", memberships: [{ team: "fenwick", role: "author" }] },
  { email: "felix.brandt@fenwick.test", name: "Felix Brandt", memberships: [{ team: "fenwick", role: "viewer" }] },
  { email: "maren.holt@larkspur.test", name: "Maren Holt", memberships: [{ team: "larkspur", role: "admin" }] },
];
