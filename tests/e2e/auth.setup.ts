import { test as setup, expect } from "@playwright/test";
import { emailOf, PASSWORD, ROLES, stateOf } from "./roles";

// Sign in once per role through the real form and keep the cookies for the other tests.
for (const role of ROLES) {
  setup(`sign in as ${role}`, async ({ page }) => {
    await page.goto("/signin");
    await page.getByLabel("E-mail").fill(emailOf(role));
    await page.getByLabel("Password").fill(PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect(page.getByRole("heading", { name: "Harrowfield Cold Store (demo)" })).toBeVisible();
    await expect(page.getByText(`your role: ${role}`)).toBeVisible();
    await page.context().storageState({ path: stateOf(role) });
  });
}
