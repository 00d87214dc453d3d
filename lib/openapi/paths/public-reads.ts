import { z } from 'zod';
import type * as Contract from '@/lib/browse/contract';
import {
  compareQuerySchema,
  COMPARE_MAX,
  COMPARE_MIN,
  gearItemQuerySchema,
  gearListQuerySchema,
  reviewListQuerySchema,
} from '@/lib/browse/query';
import { PORT_DIRECTIONS, PORT_KINDS } from '@/lib/measure';
import { errorResponses, OPTIONALLY_SIGNED_IN, slugParam, type OpenAPIRegistry } from '../registry';
import { gearRolesAndFeaturesShape } from './gear-features';

const TAG = 'Browse and reviews';

/* The answers of lib/browse/contract.ts as zod schemas for the document; the type checks at the end
 * keep the two in step. */

const imperial = z
  .object({ value: z.number(), unit: z.string() })
  .optional()
  .meta({ description: 'Only with `units=imperial`, for masses (oz/lb), lengths (in/ft) and temperatures (°F).' });

const basis = z.enum(['claimed', 'measured', 'mixed']);

const figure = z
  .object({
    value: z.number(),
    unit: z.string().meta({ description: 'Canonical unit (`g`, `lm`, `Wh`, `lm/g`, `Wh/USD` …; empty for a dimensionless ratio).' }),
    basis,
    provenance: z.string().nullable().meta({ description: 'Page of the approved field test a measured figure comes from, else null.' }),
    imperial,
  })
  .meta({ id: 'Figure' });

const port = z
  .object({
    kind: z.enum(PORT_KINDS).meta({ description: 'Connector: `usb-a`, `usb-c`, `socket-12v` (12 V accessory socket), `dc-barrel`, `binding-posts`, `genderless-dc`, `mains-input`, `solar-input`, `other` (see `label`).' }),
    direction: z.enum(PORT_DIRECTIONS),
    volts: z.number().optional().meta({ description: 'Nominal voltage, V (USB without it: 5 V; a 12 V socket: 12 V).' }),
    amps: z.number().optional().meta({ description: 'Most current delivered (output) or needed (input), A.' }),
    watts: z.number().optional().meta({ description: 'Most power delivered (output) or needed (input), W.' }),
    pdProfiles: z
      .array(z.object({ volts: z.number(), amps: z.number() }))
      .optional()
      .meta({ description: 'USB-C only: USB Power Delivery fixed profiles offered (output) or usable (input).' }),
    voltageWindow: z.object({ minVolts: z.number(), maxVolts: z.number() }).optional().meta({ description: 'Inputs only: voltages accepted, V, inclusive.' }),
    label: z.string().optional().meta({ description: 'Name of the connector; always present for `other`.' }),
    efficiency: z.number().optional().meta({ description: 'Conversion efficiency inside the item at this port, (0, 1].' }),
    number: z.number().int().meta({ description: 'Number of the port in the item’s list, from 1 (a measured figure carries the number of the port it measured).' }),
    basis: z.enum(['claimed', 'measured']).meta({ description: '`claimed` by the maker, or `measured` under load by an approved port-output field test (volts, amps and watts as read; listed right after its claimed port).' }),
    provenance: z.string().nullable().meta({ description: 'Page of the approved field test a measured figure comes from; null for a claim.' }),
  })
  .meta({ id: 'Port' });

const gearSummary = z
  .object({
    slug: z.string(),
    name: z.string(),
    maker: z.string(),
    category: z.string(),
    kind: z.string().nullable(),
    path: z.string().meta({ description: 'Public page of the item.' }),
    photo: z.object({ src: z.string(), alt: z.string(), width: z.number().int(), height: z.number().int() }).nullable(),
    price: z.object({ minor: z.number().int(), currency: z.string() }).nullable().meta({ description: 'Price paid, in minor units (cents …) of an ISO 4217 currency.' }),
    specs: z.record(z.string(), figure).meta({ description: 'Spec key → headline figure (measured preferred over claimed).' }),
    ratios: z.record(z.string(), figure).meta({ description: 'Ratio id → stored value ratio of the approved figures.' }),
    sortValue: z.number().nullable().meta({ description: 'The sorted value (price in major units); null when the item lacks it (such items come last).' }),
    reviewed: z.boolean().meta({ description: 'Has a published review.' }),
    status: z.string().optional().meta({ description: 'Only on the caller’s own items (signed-in reads): `draft`, `in-review`, `changes-requested`, `approved`.' }),
    ports: z
      .array(port)
      .optional()
      .meta({ description: 'Only in `GET /api/v1/gear/{slug}`: the claimed ports (approved ones for a public item), inputs and outputs, in the author’s order; a port measured by an approved port-output test is followed by its measured figure (`basis: measured`).' }),
    ...gearRolesAndFeaturesShape,
  })
  .meta({ id: 'GearSummary' });

const gearList = z
  .object({
    items: z.array(gearSummary),
    nextCursor: z.string().nullable().meta({ description: 'Pass back as `cursor` for the next page; null on the last page.' }),
    total: z.number().int().meta({ description: 'Items matching every filter (all pages).' }),
    excludedOtherCurrency: z.number().int().meta({ description: 'Items left out because they are priced in another currency than `currency`.' }),
    facets: z.object({
      all: z.number().int().optional().meta({ description: 'Items matching every filter except `category`, each counted once (multi-role items count under each of their categories).' }),
      categories: z.array(z.object({ id: z.string(), label: z.string(), count: z.number().int() })).meta({ description: 'Counts per category with every filter except `category`.' }),
    }),
  })
  .meta({ id: 'GearList' });

const compareCell = z.object({
  value: z.union([z.number(), z.string()]).nullable(),
  unit: z.string(),
  basis: basis.nullable(),
  provenance: z.string().nullable(),
  best: z.boolean().meta({ description: 'Best in its row, direction-aware; ties are all best; never in a row without a direction or with one value.' }),
  imperial,
});

const compareResponse = z
  .object({
    items: z.array(gearSummary.pick({ slug: true, name: true, maker: true, category: true, kind: true, path: true, photo: true, price: true })),
    groups: z.array(
      z.object({
        id: z.enum(['specs', 'ratios', 'measured-vs-claimed', 'test-conditions', 'radio-noise', 'features', 'ports']),
        label: z.string(),
        rows: z.array(
          z.object({
            key: z.string(),
            label: z.string(),
            unit: z.string(),
            direction: z.enum(['higher', 'lower']).nullable().meta({ description: 'Which value is better; null when neither (supply voltage, test conditions, per-money ratios in different currencies).' }),
            cells: z.array(compareCell).meta({ description: 'One per item, in the order of `items`.' }),
            allEqual: z.boolean(),
          }),
        ),
      }),
    ),
  })
  .meta({ id: 'Comparison' });

const reviewSummary = z
  .object({
    slug: z.string(),
    title: z.string(),
    summary: z.string(),
    verdict: z.string(),
    author: z.string(),
    disclosure: z.string().nullable().meta({ description: 'How the reviewer got the gear: `bought-retail`, `loaned-by-maker`, `given-by-maker`, `sponsored`.' }),
    firstPublishedAt: z.string().nullable().meta({ description: 'ISO 8601.' }),
    updatedAt: z.string().nullable().meta({ description: 'ISO 8601: when the shown revision was published.' }),
    revision: z.number().int(),
    path: z.string(),
    items: z.array(z.object({ slug: z.string(), name: z.string(), path: z.string() })),
  })
  .meta({ id: 'ReviewSummary' });

const reviewList = z
  .object({ items: z.array(reviewSummary), nextCursor: z.string().nullable(), total: z.number().int() })
  .meta({ id: 'ReviewList' });

const reviewDetail = reviewSummary
  .extend({
    state: z.enum(['published', 'retracted']),
    body: z.string().meta({ description: 'Markdown source.' }),
    disclosureNote: z.string(),
    correctionNote: z.string().nullable(),
    retraction: z.object({ note: z.string(), at: z.string() }).nullable(),
    history: z.array(z.object({ number: z.number().int(), state: z.string(), publishedAt: z.string().nullable(), correctionNote: z.string().nullable() })),
  })
  .meta({ id: 'Review' });

type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const inStep: [
  Same<z.output<typeof figure>, Contract.Figure>,
  Same<z.output<typeof gearSummary>, Contract.GearSummary>,
  Same<z.output<typeof gearList>, Contract.GearListResponse>,
  Same<z.output<typeof compareResponse>, Contract.CompareResponse>,
  Same<z.output<typeof reviewList>, Contract.ReviewListResponse>,
  Same<z.output<typeof reviewDetail>, Contract.ReviewDetail>,
] = [true, true, true, true, true, true];
void inStep;

const cacheHeaders = z.object({
  'Cache-Control': z.string().meta({ description: '`public, max-age=60` for anonymous reads; `private, no-store` when signed in (the answer may hold the caller’s own drafts).' }),
  ETag: z.string().optional().meta({ description: 'Anonymous reads only: a strong tag of the body; send it back as `If-None-Match` for a 304.' }),
  Vary: z.string().meta({ description: '`Authorization, Cookie`.' }),
});

const ok = (description: string, schema: z.ZodType) => ({
  200: { description, headers: cacheHeaders, content: { 'application/json': { schema } } },
  304: { description: 'Not modified: the `If-None-Match` tag matches (anonymous reads).' },
});

const ifNoneMatch = z.object({
  'If-None-Match': z.string().optional().meta({ description: 'ETag(s) of a copy you hold (weak `W/` tags and lists accepted).' }),
});

/** GET /api/v1/gear, /gear/{slug}, /compare, /reviews, /reviews/{slug} (lib/browse/handlers.ts). */
export function registerPublicReads(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: 'get',
    path: '/api/v1/gear',
    tags: [TAG],
    summary: 'Browse gear by value',
    description: [
      'Approved items (their approved figures); a signed-in caller also gets their own unpublished items, marked with `status`.',
      '',
      '- `min.<key>` / `max.<key>` (inclusive) and `sort` take any spec key (canonical units: g, lm, s, Wh, W, V, m, cd …), value ratio id (`lm-per-g`, `wh-per-money`, `measured-vs-claimed:mass` …) or `price` (major units).',
      '- `currency` is required whenever `price` or a per-money ratio is filtered or sorted; items priced in another currency are left out and counted in `excludedOtherCurrency`.',
      '- Items without the sorted value come last in either order; ties are in slug order. Without `sort`, items are in slug order.',
      '- `measured=only`: range filters and the sort use measured figures only (measured ÷ claimed always qualifies).',
      '- Every parameter appears at most once; an unknown one is a 400 naming it.',
    ].join('\n'),
    security: OPTIONALLY_SIGNED_IN,
    request: { query: gearListQuerySchema, headers: ifNoneMatch },
    responses: { ...ok('One page of items, the total, facets and the other-currency count.', gearList), ...errorResponses(400, 401) },
  });

  registry.registerPath({
    method: 'get',
    path: '/api/v1/gear/{slug}',
    tags: [TAG],
    summary: 'One gear item',
    description: 'The item’s summary as in the list (`sortValue` is null). 404 for an unknown slug and for an unpublished item that is not the caller’s.',
    security: OPTIONALLY_SIGNED_IN,
    request: { params: z.object({ slug: slugParam }), query: gearItemQuerySchema, headers: ifNoneMatch },
    responses: { ...ok('The item.', gearSummary), ...errorResponses(400, 401, 404) },
  });

  registry.registerPath({
    method: 'get',
    path: '/api/v1/compare',
    tags: [TAG],
    summary: 'Side-by-side',
    description: `${COMPARE_MIN}–${COMPARE_MAX} items, rows aligned by spec and grouped (specs, value ratios, measured ÷ claimed, test conditions); each cell with value, unit, claimed/measured, provenance link and whether it is the best in its row. 404 names the first item that is unknown or not visible.`,
    security: OPTIONALLY_SIGNED_IN,
    request: { query: compareQuerySchema, headers: ifNoneMatch },
    responses: { ...ok('The rows, one cell per item.', compareResponse), ...errorResponses(400, 401, 404) },
  });

  registry.registerPath({
    method: 'get',
    path: '/api/v1/reviews',
    tags: [TAG],
    summary: 'Published reviews',
    description: 'Reviews whose latest public revision is published, newest first; drafts never appear, whoever asks.',
    security: OPTIONALLY_SIGNED_IN,
    request: { query: reviewListQuerySchema, headers: ifNoneMatch },
    responses: { ...ok('One page of reviews.', reviewList), ...errorResponses(400, 401) },
  });

  registry.registerPath({
    method: 'get',
    path: '/api/v1/reviews/{slug}',
    tags: [TAG],
    summary: 'One review',
    description: 'The latest public revision with its Markdown body; a retracted review stays readable with the editor’s note. 404 for drafts and unknown slugs.',
    security: OPTIONALLY_SIGNED_IN,
    request: { params: z.object({ slug: z.string().min(1).max(200).meta({ description: 'The review’s slug, as in `/reviews/{slug}`.' }) }), headers: ifNoneMatch },
    responses: { ...ok('The review.', reviewDetail), ...errorResponses(400, 401, 404) },
  });
}
