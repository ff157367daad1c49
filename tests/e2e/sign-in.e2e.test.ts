import { describe, expect, it } from "vitest";
import { asVisitor, sharedBrowser } from "./support/fixtures";
import { screenshot, SignInPage } from "./support/browser";
import { pathOf, textOf } from "./support/desk";

const browser = sharedBrowser();

describe("sign-in", () => {
  it("a wrong password shows the error and keeps the visitor on the sign-in page", async () => {
    await asVisitor(browser(), async ({ context, page }) => {
      const signIn = new SignInPage(page);
      await signIn.open();
      expect(await textOf(page.getByRole("heading", { level: 1 }))).toBe("Sign in to the desk");
      // A throwaway address, so no demo account collects a failure.
      await signIn.signIn(`nobody-${Date.now()}@example.test`, "not-the-password-1");
      const error = page.getByTestId("form-error");
      expect(await textOf(error)).toBe("That e-mail and password do not match an account.");
      expect(pathOf(page)).toBe("/sign-in");
      expect(await page.getByTestId("whoami").count()).toBe(0);
      const cookies = await context.cookies();
      const session = await context.request.get("/api/v1/session");
      expect(session.status(), JSON.stringify(cookies.map((c) => c.name))).toBe(401);
      await screenshot(page, "sign-in-wrong-password");
    });
  });

  it("a signed-out visitor who opens the desk is sent to sign in", async () => {
    await asVisitor(browser(), async ({ context, page }) => {
      await page.goto("/");
      expect(pathOf(page)).toBe("/sign-in");
      expect((await context.request.get("/api/v1/session")).status()).toBe(401);
    });
  });
});
