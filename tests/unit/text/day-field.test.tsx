/** Day inputs show and read days as every page writes them ("14 Mar 2026"), not in the browser's own date format. */
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { DayField } from '@frontend/components/ui/day-field';
import { RequiredMark } from '@frontend/components/ui/required-mark';

const field = (value: string, extra: { required?: boolean; error?: string } = {}) =>
  renderToStaticMarkup(<DayField label="Cleaning date" value={value} onChange={() => undefined} {...extra} />);

describe('a day field', () => {
  it('shows a stored day as the pages write it, in a text box (no browser date format)', () => {
    const html = field('2026-03-14');
    expect(html).toMatch(/value="14 Mar 2026"/);
    expect(html).toMatch(/<input[^>]*id="[^"]+"[^>]*value="14 Mar 2026"/);
    expect(html).not.toMatch(/type="date"[^>]*aria-invalid/);
  });

  it('says beside the box why text that is not a day is refused', () => {
    const html = field('03/04/2026');
    expect(html).toMatch(/aria-invalid="true"/);
    expect(html).toMatch(/day and month in doubt/);
  });

  it('marks a required day for the eye and for screen readers', () => {
    const html = field('', { required: true });
    expect(html).toContain(renderToStaticMarkup(<RequiredMark />));
    expect(html).toMatch(/aria-required="true"/);
  });
});
