import type { RoundupEntity } from '../entities/roundup.entity';
import { cautionDefaultTexts, cautionTitles } from '../../shared/domain/editorial/caution-texts';
import { sectionReviewStateLabels, type SectionReviewState } from '../../shared/domain/editorial/section-states';

const escapeHtml = (value: string) =>
  value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);

const styles = `
  :root { color-scheme: light; }
  body { margin: 0; background: #FAF8F3; color: #1B2433; font: 1.0625rem/1.65 system-ui, sans-serif; }
  .preview-bar { position: sticky; top: 0; background: #1B2433; color: #FAF8F3; padding: .5rem 1rem; font-size: .875rem; }
  main { max-width: 44rem; margin: 0 auto; padding: 2rem 1rem 4rem; }
  h1 { font-size: 2.1rem; line-height: 1.2; margin: 0 0 .5rem; }
  h2 { font-size: 1.5rem; margin: 2.5rem 0 .75rem; border-top: 2px solid #A4521F; padding-top: .75rem; }
  h3 { font-size: 1.2rem; } h4 { font-size: 1.05rem; }
  a { color: #A4521F; }
  blockquote { margin: 1rem 0; padding-left: 1rem; border-left: 3px solid #6B7A8F; color: #5B6472; }
  .section-state { font-size: .8rem; color: #5B6472; font-weight: 600; }
  .caution { border: 2px solid #9A6A00; background: #fff; padding: .75rem 1rem; margin: 1.25rem 0; border-radius: 4px; }
  .caution-title { font-weight: 700; margin: 0 0 .25rem; }
  .caution-body p { margin: .25rem 0; }
  figure.photo { margin: 1.5rem 0; } figure.photo img { max-width: 100%; height: auto; display: block; }
  figcaption { font-size: .9rem; color: #5B6472; margin-top: .25rem; }
  .live-block { margin: 1.25rem 0; overflow-x: auto; }
  .live-block-title { font-weight: 700; margin-bottom: .25rem; }
  .live-block dl { display: grid; grid-template-columns: minmax(9rem, auto) 1fr; gap: .25rem 1rem; margin: 0; }
  .live-block dt { color: #5B6472; } .live-block dd { margin: 0; }
  table { border-collapse: collapse; width: 100%; font-variant-numeric: tabular-nums; font-size: .95rem; }
  caption { text-align: left; font-weight: 700; padding-bottom: .25rem; }
  th, td { border-bottom: 1px solid #d8d3c8; padding: .35rem .5rem; text-align: left; }
  td { text-align: right; } td:last-child { text-align: left; }
  .live-block-footnote, .photo-missing, .live-block-missing { font-size: .85rem; color: #5B6472; }
  .page-cautions { margin-top: 3rem; }
`;

/**
 * A stand-in for the public roundup page, for staff to preview the write-up from inside the app: the sections in
 * order, each rendered by renderSectionHtml from current data, and the usual cautions. The reader site replaces it.
 */
export function writeUpPreviewPage(input: {
  roundup: RoundupEntity;
  sections: { id: number; title: string; reviewState: SectionReviewState; html: string }[];
}): string {
  const sections = input.sections
    .map(
      (section) => `<section id="section-${section.id}" aria-labelledby="heading-${section.id}">
<h2 id="heading-${section.id}">${escapeHtml(section.title)}</h2>
<p class="section-state">${escapeHtml(sectionReviewStateLabels[section.reviewState])}</p>
${section.html}
</section>`,
    )
    .join('\n');
  const cautions = (['overclocking', 'hot-surface', 'test-conditions'] as const)
    .map(
      (kind) =>
        `<aside class="caution" role="note"><p class="caution-title">${escapeHtml(cautionTitles[kind])}</p><div class="caution-body"><p>${escapeHtml(cautionDefaultTexts[kind])}</p></div></aside>`,
    )
    .join('\n');
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex, nofollow">
<title>Preview: ${escapeHtml(input.roundup.title)}</title>
<style>${styles}</style>
</head>
<body>
<p class="preview-bar">Preview of the public page, for staff only: not published. Section states show beside each heading.</p>
<main>
<article>
<h1>${escapeHtml(input.roundup.title)}</h1>
${sections}
<div class="page-cautions">
${cautions}
</div>
</article>
</main>
</body>
</html>
`;
}
