import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { FormErrorSummary } from '../../src/components/ui/form-error-summary';

describe('FormErrorSummary', () => {
  it('when a submit fails, then every field problem is listed and the summary takes focus', () => {
    render(
      <FormErrorSummary
        attempt={1}
        items={[
          { fieldId: 'title', label: 'Title', message: 'Give the roundup a title.' },
          { fieldId: 'region', label: 'Region', message: 'Choose a region.' },
        ]}
      />,
    );
    const summary = screen.getByRole('alert');
    expect(summary).toBe(document.activeElement);
    expect(summary.textContent).toContain('Give the roundup a title.');
    expect(summary.textContent).toContain('Choose a region.');
  });

  it('when nothing is wrong, then nothing is shown', () => {
    const { container } = render(<FormErrorSummary items={[]} />);
    expect(container.innerHTML).toBe('');
  });
});
