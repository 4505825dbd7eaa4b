import { expect, type Locator, type Page } from '@playwright/test';

/**
 * Moves the focus to `target` with Tab (or Shift+Tab when it lies before the focus in the page), as a keyboard user
 * does. Fails when the focus comes back round to where it started without reaching it (the control cannot be reached
 * by keyboard) or stays put (a keyboard trap). Returns the number of key presses it took.
 */
export async function tabTo(page: Page, target: Locator, max = 400): Promise<number> {
  await expect(target).toBeVisible();
  const element = await target.elementHandle();
  if (!element) throw new Error(`${target} is not in the page`);
  const where = () =>
    page.evaluate((el) => {
      const active = document.activeElement;
      if (active === el) return 'here';
      if (!active || active === document.body) return 'after';
      return active.compareDocumentPosition(el) & Node.DOCUMENT_POSITION_PRECEDING ? 'before' : 'after';
    }, element);
  let position = await where();
  if (position === 'here') return 0;
  const key = position === 'before' ? 'Shift+Tab' : 'Tab';
  const seen: string[] = [];
  for (let presses = 1; presses <= max; presses++) {
    await page.keyboard.press(key);
    position = await where();
    if (position === 'here') return presses;
    const focused = await page.evaluate(() => {
      const active = document.activeElement;
      return active
        ? `${active.tagName}#${active.id}.${active.getAttribute('aria-label') ?? active.textContent?.slice(0, 40)}`
        : '';
    });
    // Date and time fields take a Tab per segment (up to six); more on one element is a trap.
    if (seen.length >= 8 && seen.slice(-8).every((f) => f === focused) && focused !== 'BODY#.') {
      throw new Error(`Keyboard trap: ${key} keeps the focus on ${focused} on the way to ${target}`);
    }
    seen.push(focused);
  }
  throw new Error(`${target} cannot be reached with ${key} (${max} presses)`);
}

/** Tab to a button or link and press Enter. */
export async function pressOn(page: Page, target: Locator) {
  await tabTo(page, target);
  await page.keyboard.press('Enter');
}

/** Tab to a checkbox or toggle and press Space. */
export async function toggle(page: Page, target: Locator) {
  await tabTo(page, target);
  await page.keyboard.press('Space');
}

/** Tab to a text field, select what is in it and type `text` over it. */
export async function typeInto(page: Page, target: Locator, text: string) {
  await tabTo(page, target);
  await page.keyboard.press('ControlOrMeta+A');
  if (text === '') await page.keyboard.press('Delete');
  else await page.keyboard.type(text);
}

/**
 * Tab to a date field and type the date in its segments. Chromium shows date fields in its own UI language here
 * (month/day/year, whatever the page's locale); the year segment of a date-and-time field takes up to six digits, so
 * the right arrow moves on to the time. `iso` is YYYY-MM-DD, or YYYY-MM-DDTHH:MM for a date-and-time field.
 */
export async function typeDate(page: Page, target: Locator, iso: string) {
  await tabTo(page, target);
  const [date, time] = iso.split('T');
  const [year, month, day] = date.split('-');
  await page.keyboard.type(`${month}${day}${year}`);
  if (time) {
    await page.keyboard.press('ArrowRight');
    await page.keyboard.type(time.replace(':', ''));
  }
  await expect(target).toHaveValue(iso);
}

/** Tab to a select and move to the option whose label matches with the arrow keys. */
export async function chooseOption(page: Page, target: Locator, label: string | RegExp) {
  await tabTo(page, target);
  const { current, wanted } = await target.evaluate(
    (select, match) => {
      const options = [...(select as HTMLSelectElement).options];
      const test = (text: string) =>
        typeof match === 'string' ? text.trim() === match : new RegExp(match.source, match.flags).test(text);
      return {
        current: (select as HTMLSelectElement).selectedIndex,
        wanted: options.findIndex((o) => test(o.label || o.text)),
      };
    },
    typeof label === 'string' ? label : { source: label.source, flags: label.flags },
  );
  expect(wanted, `an option ${label} in ${target}`).toBeGreaterThanOrEqual(0);
  for (let i = current; i < wanted; i++) await page.keyboard.press('ArrowDown');
  for (let i = current; i > wanted; i--) await page.keyboard.press('ArrowUp');
}
