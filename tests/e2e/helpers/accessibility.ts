import AxeBuilder from "@axe-core/playwright";
import { expect, type Page } from "@playwright/test";

/**
 * No serious or critical axe-core violation on the page as it stands, or only inside `include`
 * (a CSS selector). A failure lists each rule with what it asks and the elements that break it.
 */
export async function expectNoSeriousA11yViolations(page: Page, include?: string) {
  const axe = new AxeBuilder({ page });
  const result = await (include ? axe.include(include) : axe).analyze();
  const bad = result.violations.filter((v) => v.impact === "serious" || v.impact === "critical");
  expect(bad.map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(" ")).join(", ")})`)).toEqual([]);
}
