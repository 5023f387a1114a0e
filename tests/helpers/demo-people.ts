/**
 * The demo team's people, one of each role, and an admin of the other demo team, as db/seed.ts
 * creates them: the one list the integration and browser tests sign in and act as.
 */
export const DEMO_USERS = {
  admin: "ada.admin@brightwater.example",
  manager: "marta.manager@brightwater.example",
  engineer: "eli.engineer@brightwater.example",
  viewer: "vic.viewer@brightwater.example",
  otherTeam: "kai.admin@kestrel.example",
} as const;

export type DemoPerson = keyof typeof DEMO_USERS;

