import { expect, type Locator, type Page } from '@playwright/test';
import { chooseOption, pressOn, tabTo, toggle, typeDate, typeInto } from './keyboard';

/**
 * How a journey works the pages: with the mouse (Playwright's click and fill) or with the keyboard only (Tab,
 * Shift+Tab, Enter, Space, arrows and typing; see ./keyboard.ts). A journey written against this interface runs
 * both ways. Going to an address (`page.goto`) stands for typing it in the browser's address bar.
 */
export interface Driver {
  page: Page;
  keyboardOnly: boolean;
  press(target: Locator): Promise<void>;
  fill(target: Locator, text: string): Promise<void>;
  /** `iso`: YYYY-MM-DD, or YYYY-MM-DDTHH:MM for a date-and-time field. */
  date(target: Locator, iso: string): Promise<void>;
  /** HH:MM:SS into a time field. */
  time(target: Locator, value: string): Promise<void>;
  choose(target: Locator, label: string | RegExp): Promise<void>;
  check(target: Locator): Promise<void>;
  /** Selects the tab named `name` in a tab list (arrow keys between tabs, as the ARIA tabs pattern has it). */
  tab(tabs: Locator, name: string | RegExp): Promise<void>;
}

async function optionLabel(select: Locator, label: string | RegExp): Promise<string> {
  if (typeof label === 'string') return label;
  const labels = await select.locator('option').allTextContents();
  const found = labels.find((text) => label.test(text.trim()));
  expect(found, `an option ${label} in ${select}`).toBeTruthy();
  return (found as string).trim();
}

export function mouseDriver(page: Page): Driver {
  return {
    page,
    keyboardOnly: false,
    press: (target) => target.click(),
    fill: (target, text) => target.fill(text),
    date: (target, iso) => target.fill(iso),
    time: (target, value) => target.fill(value),
    choose: async (target, label) => {
      await target.selectOption({ label: await optionLabel(target, label) });
    },
    check: (target) => target.check(),
    tab: async (tabs, name) => {
      await tabs.getByRole('tab', { name }).click();
      await expect(tabs.getByRole('tab', { name })).toHaveAttribute('aria-selected', 'true');
    },
  };
}

export function keyboardDriver(page: Page): Driver {
  return {
    page,
    keyboardOnly: true,
    press: (target) => pressOn(page, target),
    fill: (target, text) => typeInto(page, target, text),
    date: (target, iso) => typeDate(page, target, iso),
    time: async (target, value) => {
      await tabTo(page, target);
      await page.keyboard.type(timeFieldKeys(value));
      await expect(target).toHaveValue(value);
    },
    choose: (target, label) => chooseOption(page, target, label),
    check: async (target) => {
      await toggle(page, target);
      await expect(target).toBeChecked();
    },
    tab: async (tabs, name) => {
      const wanted = tabs.getByRole('tab', { name });
      await tabTo(page, tabs.locator('[role=tab][tabindex="0"]'));
      for (let i = 0; i < 12 && (await wanted.getAttribute('aria-selected')) !== 'true'; i++) {
        await page.keyboard.press('ArrowRight');
      }
      await expect(wanted).toHaveAttribute('aria-selected', 'true');
    },
  };
}

/**
 * The keys that type `value` (HH:MM or HH:MM:SS, 24-hour) into a time field as Debian's Chromium draws it here: in
 * hour, minute, second and AM/PM segments whatever the page's locale (measured: typing "12" into the hour gives
 * 00 until PM is typed, and "23" does not fit the hour segment). So the hour goes in on the 12-hour clock and the
 * letter A or P sets the half of the day.
 */
function timeFieldKeys(value: string): string {
  const [hours, ...rest] = value.split(':');
  const hour = Number(hours);
  return String(hour % 12 || 12).padStart(2, '0') + rest.join('') + (hour >= 12 ? 'P' : 'A');
}
