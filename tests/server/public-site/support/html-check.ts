import { HtmlValidate } from 'html-validate';
import { expect } from 'vitest';

/**
 * html-validate's recommended rules, with two style rules set to how the templates are formatted — void elements
 * self-closed (`<meta />`, valid HTML) and the blank space left where a template's interpolation renders nothing —
 * and checkbox groups sharing one name (the compare form's boards, valid HTML sent as a repeated GET field).
 */
const validator = new HtmlValidate({
  extends: ['html-validate:recommended'],
  rules: {
    'void-style': ['error', { style: 'selfclosing' }],
    'no-trailing-whitespace': 'off',
    'form-dup-name': ['error', { shared: ['radio', 'checkbox', 'button', 'reset', 'submit'] }],
  },
});

export async function expectValidHtml(markup: string) {
  const report = await validator.validateString(markup);
  const messages = report.results.flatMap((r) =>
    r.messages.map((m) => `${m.line}:${m.column} ${m.ruleId} ${m.message}`),
  );
  expect(messages).toEqual([]);
}
