import { minorUnitDigits } from '../../shared/domain/planning/money';
import type { PublishedProduct, PublishedRoundup } from './published-roundup';
import { absoluteUrl, type ReaderSite } from './render-layout';

/**
 * Editorial labels as a rating, best first (the design notes' label set). A label outside this list gets no rating:
 * JSON-LD then carries the review without reviewRating rather than an invented number.
 */
const labelRatings: Record<string, number> = {
  'Bench pick': 4,
  Recommended: 3,
  'Fine at stock': 2,
  'Skip for overclocking': 1,
};
export const labelRatingScale = { best: 4, worst: 1 };

export function ratingForLabel(label: string | null): number | null {
  if (!label) return null;
  return labelRatings[label.trim()] ?? null;
}

/**
 * schema.org Offer for the price at publication: `price` as a plain number with a full stop and the currency's
 * minor-unit digits (no symbol or thousands separator), `priceCurrency` as the ISO 4217 code. Benchwire does not
 * track stock, so `availability` is left out rather than guessed; none at all when no price was known.
 */
export function offerJsonLd(product: PublishedProduct, url: string) {
  const price = product.priceAtPublication;
  if (!price) return null;
  const digits = minorUnitDigits(price.currency);
  return {
    '@type': 'Offer',
    price: (price.amountMinor / 10 ** digits).toFixed(digits),
    priceCurrency: price.currency,
    url,
  };
}

/**
 * schema.org for a results page: each tested board as a Product carrying our Review (author, date, URL), with a
 * reviewRating where the editor gave a label (schema.org Review and Product; REFERENCES.md "Web").
 */
export function roundupJsonLd(site: ReaderSite, model: PublishedRoundup) {
  const url = absoluteUrl(site, model.path);
  const outlet = { '@type': 'Organization', name: site.outletName, url: absoluteUrl(site, '/read') };
  return {
    '@context': 'https://schema.org',
    '@graph': model.products
      .filter((p) => p.kind === 'tested')
      .map((product) => {
        const rating = ratingForLabel(product.label);
        const offer = offerJsonLd(product, absoluteUrl(site, product.path));
        return {
          '@type': 'Product',
          '@id': `${absoluteUrl(site, product.path)}#product`,
          name: product.name,
          brand: { '@type': 'Brand', name: product.maker },
          url: absoluteUrl(site, product.path),
          ...(offer ? { offers: offer } : {}),
          review: {
            '@type': 'Review',
            name: `${product.name} in ${model.headline}`,
            url: `${url}#board-${product.entryId}`,
            datePublished: model.publishedAt,
            dateModified: model.updatedAt,
            author: outlet,
            publisher: outlet,
            itemReviewed: { '@id': `${absoluteUrl(site, product.path)}#product` },
            ...(rating !== null
              ? {
                  reviewRating: {
                    '@type': 'Rating',
                    ratingValue: rating,
                    bestRating: labelRatingScale.best,
                    worstRating: labelRatingScale.worst,
                    ratingExplanation: product.label,
                  },
                }
              : {}),
          },
        };
      }),
  };
}
