import { describe, expect, it } from "vitest";
import { assertCan, can, POLICY, ROLES, type Actor, type Action } from "@/lib/authz/policy";
import { AppError } from "@/lib/errors";

const actor = (role: Actor["role"], teamId = "team-a", userId = `u-${role}`): Actor => ({
  userId,
  email: `${role}@example.test`,
  name: role,
  teamId,
  teamName: "Team A",
  role,
});

describe("the permission table", () => {
  it("gives admins every action", () => {
    for (const action of Object.keys(POLICY) as Action[]) expect(can(actor("admin"), action), action).toBe(true);
  });

  it("lets viewers only read", () => {
    const allowed = (Object.keys(POLICY) as Action[]).filter((a) => can(actor("viewer"), a));
    expect(allowed.sort()).toEqual(["cost.read", "inventory.read", "pin.read", "project.list", "project.read", "token.manage"]);
  });

  it("limits engineers to changing their own projects", () => {
    const eng = actor("engineer");
    expect(can(eng, "project.update", { teamId: "team-a", createdBy: eng.userId })).toBe(true);
    expect(can(eng, "project.update", { teamId: "team-a", createdBy: "someone-else" })).toBe(false);
    expect(can(actor("manager"), "project.update", { teamId: "team-a", createdBy: "someone-else" })).toBe(true);
  });

  it("never allows anything on another team's record", () => {
    for (const role of ROLES) {
      for (const action of Object.keys(POLICY) as Action[]) {
        expect(can(actor(role), action, { teamId: "team-b" }), `${role} ${action}`).toBe(false);
      }
    }
  });
});

describe("assertCan", () => {
  it("reports another team's record as not found, not forbidden", () => {
    const err = (() => {
      try {
        assertCan(actor("admin"), "project.read", { teamId: "team-b" }, "project");
      } catch (e) {
        return e;
      }
    })();
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).code).toBe("not_found");
    expect((err as AppError).status).toBe(404);
  });

  it("names the role in a refusal", () => {
    expect(() => assertCan(actor("viewer"), "project.create")).toThrow("A viewer cannot create a project");
    expect(() => assertCan(actor("engineer"), "member.list")).toThrow("An engineer cannot list members");
  });
});
