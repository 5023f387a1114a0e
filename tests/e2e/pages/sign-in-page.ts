import { expect, type Page } from "@playwright/test";

export class SignInPage {
  constructor(private readonly page: Page) {}

  async open() {
    await this.page.goto("/signin");
    // The tabs stay disabled until React runs in the page; typing or clicking before that is lost.
    await expect(this.page.getByRole("tab", { name: "Password" })).toBeEnabled();
  }

  async withPassword(email: string, password: string) {
    await this.page.getByRole("tab", { name: "Password" }).click();
    const form = this.page.getByRole("form", { name: "Sign in with password" });
    await form.getByLabel("E-mail").fill(email);
    await form.getByLabel("Password").fill(password);
    await form.getByRole("button", { name: "Sign in" }).click();
  }

  async askForLink(email: string) {
    await this.page.getByRole("tab", { name: "E-mail link" }).click();
    const form = this.page.getByRole("form", { name: "Sign in with an e-mail link" });
    await form.getByLabel("E-mail").fill(email);
    await form.getByRole("button", { name: "Send sign-in link" }).click();
  }
}
