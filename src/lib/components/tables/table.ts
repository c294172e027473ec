/*
 * What the revision's tables share: the table features registered once (sorting, a filter
 * over every column, pages of rows) and a plain column description that DataTable turns into
 * the table's column definitions.
 */
import {
	columnFilteringFeature,
	constructSortFn,
	createFilteredRowModel,
	createPaginatedRowModel,
	createSortedRowModel,
	filterFn_includesString,
	globalFilteringFeature,
	rowPaginationFeature,
	rowSortingFeature,
	sortFn_alphanumeric,
	sortFn_basic,
	tableFeatures
} from '@tanstack/svelte-table';
import { compare, parseDecimal } from '$lib/tolerance/decimal';

/** Decimal strings in order of their exact value (`9.5` before `12.018`, `-0.003` before 0). */
const sortFn_decimal = constructSortFn({
	resolveDataValue: (value: unknown) =>
		typeof value === 'string' ? (parseDecimal(value, 'mm')?.value ?? null) : null,
	sort: (a, b) => (a === null || b === null ? 0 : compare(a, b))
});

export const features = tableFeatures({
	rowSortingFeature,
	sortedRowModel: createSortedRowModel(),
	sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic, decimal: sortFn_decimal },
	columnFilteringFeature,
	globalFilteringFeature,
	filteredRowModel: createFilteredRowModel(),
	filterFns: { includesString: filterFn_includesString },
	rowPaginationFeature,
	paginatedRowModel: createPaginatedRowModel()
});
export type Features = typeof features;

export interface TableColumn<T> {
	id: string;
	header: string;
	/** What the column sorts and filters by; null sorts last and shows `empty`. */
	value: (row: T) => string | number | null;
	/** How a value shows, when not as it is. */
	text?: (row: T) => string;
	/** Shown for null (default: blank). */
	empty?: string;
	/** `decimal`: exact decimal strings; `number`; `text` (default: natural order). */
	sort?: 'decimal' | 'number' | 'text';
	/** Right-aligned, tabular figures. */
	numeric?: boolean;
	/** Left out of the filter (default: included). */
	unfiltered?: boolean;
}

export const pageSizes = [50, 100, 250] as const;
