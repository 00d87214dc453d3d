/**
 * The shapes of the public read API (`GET /api/v1/gear`, `/gear/{slug}`, `/compare`), shared by the
 * route handlers, the browse page, the side-by-side and the best-value line. Pure types: no framework
 * imports. The zod schemas of the query parameters live beside this file (query.ts) and feed the
 * OpenAPI document.
 */

import type { Port } from '@/lib/measure';

export type FigureBasis = 'claimed' | 'measured' | 'mixed';

/** One figure of an item: a spec (claimed or measured) or a value ratio, in canonical units. */
export interface Figure {
  value: number;
  /** Canonical unit symbol (`g`, `lm`, `Wh`, `lm/g`, `Wh/USD`; empty for a dimensionless ratio). */
  unit: string;
  basis: FigureBasis;
  /** Page of the approved field test a measured figure comes from (`/field-tests/{id}`), else null. */
  provenance: string | null;
  /** Present only with `units=imperial` for masses, lengths and temperatures. */
  imperial?: { value: number; unit: string };
}

export interface GearSummary {
  slug: string;
  name: string;
  maker: string;
  category: string;
  kind: string | null;
  /** Public page of the item. */
  path: string;
  photo: { src: string; alt: string; width: number; height: number } | null;
  price: { minor: number; currency: string } | null;
  /** Spec key → figure (measured preferred over claimed for the headline value). */
  specs: Record<string, Figure>;
  /** Ratio id (`lm-per-g`, `measured-vs-claimed:mass` …) → figure, from the stored gear_ratios. */
  ratios: Record<string, Figure>;
  /** The value sorted by (spec or ratio) or null when the item lacks it (such items come last). */
  sortValue: number | null;
  reviewed: boolean;
  /** `draft`, `in-review` … only in authenticated responses that include the caller's own unpublished items. */
  status?: string;
  /**
   * Claimed ports (lib/measure `Port`, V/A/W), approved ones for a public item, each followed by its
   * measured figure when a port-output test measured it; only in `GET /api/v1/gear/{slug}`.
   */
  ports?: (Port & { number: number; basis: 'claimed' | 'measured'; provenance: string | null })[];
  /** Other categories the item also serves as (never its primary one); it is listed under each of them too. Present in every gear answer. */
  alsoServesAs?: string[];
  /** The feature checklist of all its roles: `has`, `has-not` or `not-stated`, with a detail such as a hook's material. */
  features?: { name: string; label: string; state: 'has' | 'has-not' | 'not-stated'; detail: string | null }[];
}

export interface GearListResponse {
  items: GearSummary[];
  /** Opaque; pass back as `cursor` for the next page; null on the last page. */
  nextCursor: string | null;
  /** Items matching every filter (all pages). */
  total: number;
  /** Items left out because their price is in another currency than `currency` (0 when not filtering by money). */
  excludedOtherCurrency: number;
  /** Counts per category with every filter except `category` applied. */
  facets: {
    categories: { id: string; label: string; count: number }[];
    /** Items matching every filter except `category`, each once (an item serving as two categories counts in both of those). */
    all?: number;
  };
}

export type RowDirection = 'higher' | 'lower' | null;

export interface CompareCell {
  value: number | string | null;
  unit: string;
  basis: FigureBasis | null;
  provenance: string | null;
  /** Best in its row (direction-aware; ties all best; false when the row has no direction). */
  best: boolean;
  /** Present only with `units=imperial` for masses, lengths and temperatures (as on Figure). */
  imperial?: { value: number; unit: string };
}

export interface CompareRow {
  /** Spec key, ratio id, `measured-vs-claimed:<key>` or a test-condition key. */
  key: string;
  label: string;
  unit: string;
  direction: RowDirection;
  /** One cell per item, in the order of `items`. */
  cells: CompareCell[];
  /** True when every cell holds the same value (the side-by-side may hide it). */
  allEqual: boolean;
}

export interface CompareGroup {
  id: 'specs' | 'ratios' | 'measured-vs-claimed' | 'test-conditions' | 'radio-noise' | 'features' | 'ports';
  label: string;
  rows: CompareRow[];
}

export interface CompareResponse {
  items: Pick<GearSummary, 'slug' | 'name' | 'maker' | 'category' | 'kind' | 'path' | 'photo' | 'price'>[];
  groups: CompareGroup[];
}

/** A published review in `GET /api/v1/reviews` (the latest public revision, never a draft). */
export interface ReviewSummary {
  slug: string;
  title: string;
  summary: string;
  verdict: string;
  author: string;
  /** How the reviewer got the gear (`bought-retail`, `loaned-by-maker` …), null when not stated. */
  disclosure: string | null;
  /** ISO 8601: when revision 1 was published. */
  firstPublishedAt: string | null;
  /** ISO 8601: when the shown revision was published. */
  updatedAt: string | null;
  revision: number;
  /** Public page of the review. */
  path: string;
  /** Public gear items the review covers. */
  items: { slug: string; name: string; path: string }[];
}

export interface ReviewListResponse {
  items: ReviewSummary[];
  /** Opaque; pass back as `cursor` for the next page; null on the last page. */
  nextCursor: string | null;
  /** Reviews matching the filter (all pages). */
  total: number;
}

/** `GET /api/v1/reviews/{slug}`: the latest public revision with its Markdown body. */
export interface ReviewDetail extends ReviewSummary {
  /** `retracted` reviews stay readable with the editor's public note. */
  state: 'published' | 'retracted';
  /** Markdown source of the body. */
  body: string;
  disclosureNote: string;
  correctionNote: string | null;
  retraction: { note: string; at: string } | null;
  /** Public revisions, newest first. */
  history: { number: number; state: string; publishedAt: string | null; correctionNote: string | null }[];
}
