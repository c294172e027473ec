/*
 * Features of size as the API answers them (PRODUCT.md §6), for the board and other clients.
 * No server or database import: safe in the browser.
 */
import type { z } from 'zod';
import type { featureInput, featurePatch, featureResponse } from '$lib/schemas/features';
import type { FeatureKind as CoreFeatureKind } from '$lib/tolerance/rulebook';

/** Feature kinds (API values). */
export const featureKinds = [
	'hole',
	'bore',
	'pin',
	'shaft',
	'slot',
	'tab',
	'width',
	'thread',
	'other'
] as const satisfies readonly CoreFeatureKind[];
export type FeatureKind = (typeof featureKinds)[number];

/** Kinds that are holes unless said otherwise (an ISO 286 code's letter case decides first). */
export const internalKinds: readonly FeatureKind[] = ['hole', 'bore', 'slot'];

/** One feature with its computed values and per-feature rulebook results. */
export type FeatureJson = z.output<typeof featureResponse>;
/** POST …/revisions/{letter}/features */
export type NewFeature = z.input<typeof featureInput>;
/** PATCH …/features/{id}: `version` and only what changes. */
export type FeatureChanges = z.input<typeof featurePatch>;
export type MarkerLocation = NonNullable<FeatureJson['location']>;
