import { isHttpError, type RequestEvent } from '@sveltejs/kit';
import { describe, expect, test } from 'vitest';
import * as advise from '../../src/routes/api/v1/calc/advise/+server';
import * as fit from '../../src/routes/api/v1/calc/fit/+server';
import * as size from '../../src/routes/api/v1/calc/size/+server';

type Handler = (event: RequestEvent) => Response | Promise<Response>;

function event(path: string, init?: { body: unknown }): RequestEvent {
	const url = new URL(`http://localhost${path}`);
	const request = new Request(url, {
		method: init ? 'POST' : 'GET',
		headers: { 'content-type': 'application/json' },
		body: init ? JSON.stringify(init.body) : undefined
	});
	return { url, request } as unknown as RequestEvent;
}

async function call(handler: Handler, path: string, body?: unknown) {
	try {
		const response = await handler(event(path, body === undefined ? undefined : { body }));
		return { status: response.status, body: await response.json() };
	} catch (e) {
		if (isHttpError(e))
			return { status: e.status, body: e.body as unknown as Record<string, unknown> };
		throw e;
	}
}

const getSize = (query: string) => call(size.GET as Handler, `/api/v1/calc/size?${query}`);

describe('GET /api/v1/calc/size', () => {
	test('an ISO code: limits, MMC, LMC, envelope, gauges and the caution', async () => {
		const r = await getSize(`callout=${encodeURIComponent('Ø25 H7')}&units=mm&standard=iso`);
		expect(r.status).toBe(200);
		expect(r.body).toMatchObject({
			upper: '25.021',
			lower: '25.000',
			tolerance: '0.021',
			mmc: '25.000',
			lmc: '25.021',
			envelope: { applies: false },
			gauges: { go: '25.000', noGo: '25.021' },
			standard: 'iso-8015',
			formDeviation: 'unbounded'
		});
		expect(r.body.caution).toMatch(/advisory/);
	});

	test('findings: stated limits that disagree with the code beside them are said (ISO 286-2)', async () => {
		const clean = await getSize(`callout=${encodeURIComponent('Ø25 H7')}&units=mm&standard=iso`);
		expect(clean.body.findings).toEqual([]);
		// H7 at 25 mm is 25.000/25.021; 25.030 disagrees.
		const r = await getSize(
			`callout=${encodeURIComponent('Ø25 H7 (25.000-25.030)')}&units=mm&standard=iso`
		);
		expect(r.status).toBe(200);
		expect(r.body.upper).toBe('25.030');
		expect(r.body.findings).toEqual([
			{
				rule: 'LIM-04',
				severity: 'major',
				message: 'The limits written beside H7 are not the limits H7 gives.',
				line: 'stated 25.000–25.030, H7 at 25.000 gives 25.000–25.021 (ISO 286-2)'
			}
		]);
	});

	test('plain inch limits need feature and keep the places', async () => {
		const r = await getSize(`callout=.8750-.8745&units=in&feature=external&standard=asme`);
		expect(r.body).toMatchObject({
			upper: '0.8750',
			lower: '0.8745',
			mmc: '0.8750',
			envelope: { applies: true },
			standard: 'asme-y14.5-2018'
		});
		const missing = await getSize(`callout=.8750-.8745&units=in&standard=asme`);
		expect(missing.status).toBe(400);
		expect(missing.body).toMatchObject({ code: 'invalid', field: 'internal' });
	});

	test('a bad callout is 400 with the position', async () => {
		const r = await getSize(
			`callout=${encodeURIComponent('Ø25 +0.021/x')}&units=mm&feature=internal`
		);
		expect(r.status).toBe(400);
		expect(r.body.code).toBe('invalid');
		expect(typeof r.body.message).toBe('string');
		// 'Ø25 +0.021/x': the lower deviation should be a number; 'x' is character 11.
		expect(r.body.position).toBe(11);
	});

	test('bad query values are 400', async () => {
		expect((await getSize('callout=25&units=cm')).status).toBe(400);
		expect((await getSize('callout=25&standard=din')).status).toBe(400);
		expect((await getSize('units=mm')).status).toBe(400);
	});
});

describe('POST /api/v1/calc/size', () => {
	test('a geometric tolerance at MMC and an actual size', async () => {
		const r = await call(size.POST as Handler, '/api/v1/calc/size', {
			callout: 'Ø.500-.505',
			units: 'in',
			feature: 'internal',
			standard: 'asme-y14.5-2018',
			geometric: {
				characteristic: 'position',
				value: '.010',
				diameterZone: true,
				modifier: 'mmc',
				datums: ['A', 'B', 'C']
			},
			actual: '.503'
		});
		expect(r.status).toBe(200);
		expect(r.body).toMatchObject({
			virtualCondition: '0.490',
			resultantCondition: '0.520',
			innerBoundary: '0.490',
			outerBoundary: '0.520'
		});
		expect(r.body.geometric[0]).toMatchObject({ bonus: '0.003', allowed: '0.013' });
	});

	test('RFS gives boundaries only', async () => {
		const r = await call(size.POST as Handler, '/api/v1/calc/size', {
			callout: 'Ø10 +0.2/0',
			feature: 'internal',
			standard: 'asme',
			geometric: [{ characteristic: 'position', value: 0.1, modifier: 'rfs' }]
		});
		expect(r.body).toMatchObject({ innerBoundary: '9.9', outerBoundary: '10.3' });
		expect(r.body).not.toHaveProperty('virtualCondition');
	});

	test('a general tolerance applies when the callout carries none', async () => {
		const r = await call(size.POST as Handler, '/api/v1/calc/size', {
			callout: '25',
			feature: 'external',
			standard: 'iso-8015',
			generalTolerance: { kind: 'iso2768', linear: 'm', geometric: 'K', envelope: true }
		});
		expect(r.body).toMatchObject({
			upper: '25.2',
			lower: '24.8',
			limitsSource: 'general',
			envelope: { applies: true }
		});
	});

	test.each([
		['declared JSON but is not', 'application/json', 400],
		['is not declared JSON (415: a browser sends that cross-site unasked)', 'text/plain', 415]
	])('a body that %s', async (_, type, status) => {
		const request = new Request('http://localhost/api/v1/calc/size', {
			method: 'POST',
			headers: { 'content-type': type },
			body: 'callout=25'
		});
		try {
			await (size.POST as Handler)({
				request,
				url: new URL(request.url)
			} as unknown as RequestEvent);
			expect.unreachable();
		} catch (e) {
			expect(isHttpError(e) && e.status).toBe(status);
		}
	});
});

describe('POST /api/v1/calc/fit', () => {
	test('Ø25 H7/g6 (ASME B4.2 table 1, recalled): clearance 0.007 to 0.041', async () => {
		const r = await call(fit.POST as Handler, '/api/v1/calc/fit', {
			hole: { callout: 'Ø25 H7' },
			shaft: { callout: 'Ø25 g6' },
			units: 'mm',
			standard: 'iso',
			intent: 'running'
		});
		expect(r.status).toBe(200);
		expect(r.body).toMatchObject({
			minClearance: '0.007',
			maxClearance: '0.041',
			classification: 'clearance',
			hole: { upper: '25.021', lower: '25.000' },
			shaft: { upper: '24.993', lower: '24.980' },
			verdict: 'pass'
		});
		expect(r.body).not.toHaveProperty('minClearanceAtBoundary');
		expect(r.body.caution).toMatch(/qualified checker/);
	});

	test('boundaries when geometric tolerances apply', async () => {
		const r = await call(fit.POST as Handler, '/api/v1/calc/fit', {
			hole: { callout: 'Ø12 H7 Ⓔ' },
			shaft: {
				callout: 'Ø12 g6',
				geometric: {
					characteristic: 'straightness',
					value: '0.02',
					diameterZone: true,
					appliesTo: 'median',
					modifier: 'mmc'
				}
			},
			units: 'mm',
			standard: 'iso-8015',
			intent: 'running'
		});
		expect(r.body).toMatchObject({
			minClearance: '0.006',
			minClearanceAtBoundary: '-0.014',
			verdict: 'fail'
		});
	});

	test('a fastener and its budget', async () => {
		const r = await call(fit.POST as Handler, '/api/v1/calc/fit', {
			hole: {
				callout: 'Ø6.6 +0.2/0',
				geometric: { characteristic: 'position', value: '0.6', diameterZone: true, modifier: 'mmc' }
			},
			fastener: { callout: 'M6' },
			units: 'mm',
			standard: 'iso-8015',
			intent: 'floating-fastener'
		});
		expect(r.body).toMatchObject({
			fastenerBudget: { formula: 'floating', available: '0.6', ok: true }
		});
		expect(r.body).toHaveProperty('fastener');
	});

	test('the fastener budget by modifier: t + T at LMC (Ø6.6 +0.2/0, Ø0.5 Ⓛ, M6; recalled)', async () => {
		const budget = async (modifier: string) =>
			(
				await call(fit.POST as Handler, '/api/v1/calc/fit', {
					hole: {
						callout: 'Ø6.6 +0.2/0',
						geometric: { characteristic: 'position', value: '0.5', diameterZone: true, modifier }
					},
					fastener: { callout: 'M6' },
					units: 'mm',
					standard: 'iso-8015',
					intent: 'floating-fastener'
				})
			).body;
		expect((await budget('mmc')).fastenerBudget).toMatchObject({
			used: '0.5',
			ok: true,
			modifier: 'mmc'
		});
		const lmc = await budget('lmc');
		expect(lmc.fastenerBudget).toMatchObject({
			available: '0.6',
			used: '0.7',
			ok: false,
			modifier: 'lmc',
			holeTooSmall: false
		});
		expect(lmc.fastenerBudget.boundary).toContain('MMC − t − T');
		expect(lmc.verdict).toBe('fail');
	});

	test('a fixed fastener larger than its hole fails with the numbers', async () => {
		const r = await call(fit.POST as Handler, '/api/v1/calc/fit', {
			hole: { callout: 'Ø5.5 ±0.1' },
			fastener: { callout: 'M6', fixedPosition: '0.1' },
			units: 'mm',
			standard: 'iso-8015',
			intent: 'fixed-fastener'
		});
		expect(r.body.fastenerBudget).toMatchObject({
			available: '-0.6',
			ok: false,
			holeTooSmall: true
		});
		expect(r.body.verdict).toBe('fail');
	});

	test('sharedDatumFrame decides whether perpendicularity enters the boundary', async () => {
		const body = (sharedDatumFrame?: boolean) => ({
			hole: {
				callout: 'Ø12 H7 Ⓔ',
				geometric: {
					characteristic: 'perpendicularity',
					value: '0.02',
					diameterZone: true,
					modifier: 'mmc',
					datums: ['A']
				}
			},
			shaft: { callout: 'Ø12 g6 Ⓔ' },
			units: 'mm',
			standard: 'iso-8015',
			intent: 'running',
			...(sharedDatumFrame === undefined ? {} : { sharedDatumFrame })
		});
		const alone = (await call(fit.POST as Handler, '/api/v1/calc/fit', body())).body;
		expect(alone).toMatchObject({ sharedDatumFrame: false, countedControls: [], verdict: 'pass' });
		const shared = (await call(fit.POST as Handler, '/api/v1/calc/fit', body(true))).body;
		expect(shared).toMatchObject({
			countedControls: ['hole: perpendicularity Ø0.02 Ⓜ'],
			minClearanceAtBoundary: '-0.014',
			verdict: 'fail'
		});
	});

	test('a fit at its operating temperature fails when it fails there', async () => {
		const r = await call(fit.POST as Handler, '/api/v1/calc/fit', {
			hole: { callout: 'Ø18 H7' },
			shaft: { callout: 'Ø18 p6' },
			units: 'mm',
			standard: 'iso-8015',
			intent: 'interference',
			temperature: { operating: '80', holeCoefficient: '23.6', shaftCoefficient: '17.5' }
		});
		expect(r.body).toMatchObject({
			maxClearance: '0.000',
			verdict: 'fail',
			temperature: {
				operating: '80',
				minClearance: '-0.0224',
				maxClearance: '0.0066',
				classification: 'transition',
				checks: [{ ok: false, text: 'maximum clearance 0.0066' }]
			}
		});
	});

	test('members on different drawings: each its own standard, the fit in the hole unit', async () => {
		const r = await call(fit.POST as Handler, '/api/v1/calc/fit', {
			hole: { callout: 'Ø6.4 +0.1/0', standard: 'iso' },
			shaft: { callout: 'Ø.2490-.2495', units: 'in', standard: 'asme' },
			units: 'mm'
		});
		expect(r.status).toBe(200);
		expect(r.body).toMatchObject({
			units: 'mm',
			minClearance: '0.0627',
			shaftInHoleUnits: { upper: '6.3373', lower: '6.3246' },
			hole: { envelope: { applies: false } },
			shaft: { units: 'in', envelope: { applies: true } }
		});
	});

	test('each member carries its findings', async () => {
		const r = await call(fit.POST as Handler, '/api/v1/calc/fit', {
			hole: { callout: 'Ø25 H7 (25.000-25.030)' },
			shaft: { callout: 'Ø25 g6' },
			units: 'mm',
			standard: 'iso'
		});
		expect(r.body.hole.findings.map((f: { rule: string }) => f.rule)).toEqual(['LIM-04']);
		expect(r.body.shaft.findings).toEqual([]);
	});

	test('a bad shaft callout names the member and the position', async () => {
		const r = await call(fit.POST as Handler, '/api/v1/calc/fit', {
			hole: { callout: 'Ø25 H7' },
			shaft: { callout: 'Ø25 G6' },
			units: 'mm'
		});
		expect(r.status).toBe(400);
		expect(r.body).toMatchObject({ code: 'invalid', field: 'shaft.callout', position: 4 });
	});

	test('neither shaft nor fastener', async () => {
		const r = await call(fit.POST as Handler, '/api/v1/calc/fit', { hole: { callout: 'Ø25 H7' } });
		expect(r.status).toBe(400);
	});
});

describe('POST /api/v1/calc/advise', () => {
	test('ISO preferred fits for a metric size', async () => {
		const r = await call(advise.POST as Handler, '/api/v1/calc/advise', {
			basicSize: '25',
			units: 'mm',
			wanted: 'locational-clearance'
		});
		expect(r.status).toBe(200);
		expect(r.body.proposals.map((p: { designation: string }) => p.designation)).toEqual([
			'H7/g6',
			'H7/h6',
			'G7/h6',
			'H7/h6'
		]);
		expect(r.body.caution).toMatch(/advisory/);
	});

	test('a bad size', async () => {
		const r = await call(advise.POST as Handler, '/api/v1/calc/advise', { basicSize: 'x' });
		expect(r.status).toBe(400);
	});
});
