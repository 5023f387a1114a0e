import { expect, test, type APIRequestContext } from "@playwright/test";
import { openPage, signedInContext } from "./fixtures";
import { createModel, submitSweep, waitForSweep, type CandidatePage } from "./sweep-fixtures";
import { expectNoSeriousA11yViolations } from "./helpers/accessibility";
import { browserAs, closeAll } from "./helpers/sign-in";

let engineer: APIRequestContext;
let manager: APIRequestContext;
let pinId: string;
const projectName = `Inbox study ${Date.now().toString(36)}`;

const inboxIds = async () => ((await (await manager.get("/api/reviews")).json()) as { reviews: { pinId: string }[] }).reviews.map((r) => r.pinId);
const inboxCount = async () => ((await (await manager.get("/api/reviews")).json()) as { count: number }).count;

test.beforeAll(async () => {
  engineer = await signedInContext("engineer");
  manager = await signedInContext("manager");
  // A project of its own, so this pin supersedes nobody else's.
  const created = await engineer.post("/api/projects", { data: { name: projectName, description: "review inbox" } });
  expect(created.status()).toBe(201);
  const projectId = ((await created.json()) as { project: { id: string } }).project.id;
  const { version } = await createModel(engineer, projectId);
  const sweep = await submitSweep(engineer, projectId, version.id, [], 1);
  await waitForSweep(engineer, sweep.id);
  const page = (await (await engineer.get(`/api/sweeps/${sweep.id}/scenarios/0/candidates`)).json()) as CandidatePage;
  const best = page.items.find((c) => c.feasible)!;
  const pinned = await engineer.post(`/api/candidates/${best.id}/pin`, { data: { note: "inbox check" } });
  expect(pinned.status()).toBe(201);
  pinId = ((await pinned.json()) as { pin: { id: string } }).pin.id;
});
test.afterAll(() => closeAll(engineer, manager));

test("the manager's inbox lists the waiting pin, the header counts it, and approving removes it from both", async ({ browser }) => {
  const ctx = await browserAs(browser, manager);
  const page = await openPage(ctx, "/reviews");
  const item = page.getByTestId("review-item").filter({ hasText: projectName });
  await expect(item).toBeVisible();
  await expect(item).toContainText("inbox check");
  await expect(item.getByRole("link", { name: projectName })).toHaveAttribute("href", /\/projects\/[0-9a-f-]{36}$/);
  // Other specs pin at the same time: the header shows what the server counts at that moment.
  await expect.poll(async () => Number(await page.getByTestId("review-count").textContent()) === (await inboxCount())).toBe(true);
  await expectNoSeriousA11yViolations(page);

  await item.getByLabel("Review comment").fill("Volume within the plot allowance");
  await item.getByRole("button", { name: "Approve" }).click();
  await expect(item).toHaveCount(0);
  expect(await inboxIds()).not.toContain(pinId);
  await expect.poll(async () => Number(await page.getByTestId("review-count").textContent()) === (await inboxCount())).toBe(true);
  const { pin } = (await (await manager.get(`/api/pins/${pinId}`)).json()) as { pin: { state: string } };
  expect(pin.state).toBe("approved");
  await ctx.close();
});

test("engineers have no inbox and no count in the header", async ({ browser }) => {
  const ctx = await browserAs(browser, engineer);
  const page = await openPage(ctx, "/");
  await expect(page.getByRole("link", { name: /^Reviews/ })).toHaveCount(0);
  expect((await engineer.get("/api/reviews")).status()).toBe(403);
  await ctx.close();
});
