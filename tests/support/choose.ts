import type { Locator, Page } from 'playwright-core';

/**
 * Chooses an option of a select inside `scope` and waits until the field shows it. On a loaded machine
 * the menu may still be opening or closing when the option is clicked and the click is lost: then the
 * menu is opened again, a few times at most.
 */
export async function chooseOption(page: Page, scope: Locator, field: string, option: string, attempts = 4): Promise<void> {
  for (let i = 1; ; i++) {
    await scope.getByRole('combobox', { name: field }).click({ force: true });
    await page.getByRole('option', { name: option }).click({ timeout: 15_000 }).catch(() => undefined);
    try {
      await scope.getByText(option).first().waitFor({ timeout: 10_000 });
      await page.getByRole('listbox').waitFor({ state: 'detached', timeout: 5_000 }).catch(() => undefined);
      return;
    } catch (err) {
      if (i >= attempts) throw err;
      await page.keyboard.press('Escape');
    }
  }
}
