import type { CautionKind } from '../../schemas/write-up-document';

// The safety notes a write-up can carry in a caution block: the usual cautions of a board review. The writer may
// reword the text; the heading always says what kind of caution it is.

export const cautionTitles: Record<CautionKind, string> = {
  overclocking: 'Caution: overclocking',
  'hot-surface': 'Caution: hot surfaces',
  mains: 'Caution: mains power',
  'test-conditions': 'Caution: our test conditions',
};

export const cautionDefaultTexts: Record<CautionKind, string> = {
  overclocking:
    'Overclocking and raised voltages can shorten component life and void warranties. Follow the maker’s limits.',
  'hot-surface':
    'Power-delivery heatsinks and board rears get hot enough to burn under load. Let the board cool before touching it.',
  mains: 'Work on mains-powered gear only when it is switched off and unplugged, and follow local electrical rules.',
  'test-conditions':
    'These results come from one open test system in a controlled room; a closed case in a warm room may run hotter.',
};
