import { HtmlValidate } from 'html-validate';
import { expect } from 'vitest';

/**
 * html-validate's recommended rules, with two style rules set to how the templates are formatted: void elements
 * self-closed (`<meta />`, valid HTML) and the blank space left where a template's interpolation renders nothing.
 */
const validator = new HtmlValidate({
  extends: ['html-validate:recommended'],
  rules: { 'void-style': ['error', { style: 'selfclosing' }], 'no-trailing-whitespace': 'off' },
});

export async function expectValidHtml(markup: string) {
  const report = await validator.validateString(markup);
  const messages = report.results.flatMap((r) =>
    r.messages.map((m) => `${m.line}:${m.column} ${m.ruleId} ${m.message}`),
  );
  expect(messages).toEqual([]);
}
