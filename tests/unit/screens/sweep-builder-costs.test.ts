import { describe, expect, it } from "vitest";
import { builderPathOf, builderToRequest, defaultBuilderValues } from "@/components/sweep-builder/builder-form-state";
import { basisToForm, formToBody } from "@/components/costs/cost-basis-form-state";
import { defaultCostBasis } from "@/lib/costs/cost-basis";

const VERSION = "00000000-0000-4000-8000-000000000001";

describe("the sweep builder's costing", () => {
  it("sends the installation factor and reuse with the cost objective only", () => {
    const v = { ...defaultBuilderValues(VERSION), objective: "cost" as const, installationFactor: "3.5", reuseInventory: true };
    expect(builderToRequest(v).body!.costing).toEqual({ installationFactor: 3.5, reuseInventory: true });
    expect(builderToRequest({ ...v, objective: "volume" }).body!.costing).toBeUndefined();
  });

  it("asks for the factor when reuse is ticked without one", () => {
    const { body, issues } = builderToRequest({ ...defaultBuilderValues(VERSION), objective: "cost", installationFactor: "", reuseInventory: true });
    expect(body).toBeNull();
    expect(issues.map((i) => i.path)).toEqual(["installationFactor"]);
  });

  it("shows the server's costing errors beside the fields", () => {
    expect(builderPathOf("costing.installationFactor")).toBe("installationFactor");
    expect(builderPathOf("costing.reuseInventory")).toBe("reuseInventory");
  });
});

describe("the cost basis form", () => {
  it("round-trips the defaults, and sends text that is not a number as text so the server names the field", () => {
    const basis = defaultCostBasis();
    expect(formToBody(basisToForm(basis))).toEqual(basis);
    const body = formToBody({ ...basisToForm(basis), "vessels.PFR.n": "six tenths" }) as { vessels: { PFR: { n: unknown } } };
    expect(body.vessels.PFR.n).toBe("six tenths");
  });
});
