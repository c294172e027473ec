/*
 * The rulebook through the API: who may run a check and change the team's rulebook settings,
 * what a check answers, waivers, the findings filters of the check summary, and a team severity
 * that follows at once. Check value: ISO 286-2:2010 table (H7 over 18 up to 30 mm is 0/+0.021),
 * so Ø25 H7 stated as 25.000/25.025 disagrees with its class (LIM-04).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { actors, draftRevision, roleClients, type Actor } from './revisions';

let clients: Awaited<ReturnType<typeof roleClients>>['clients'];
let outsiderTeam = '';

const wrongBore = { kind: 'bore', label: 'Bore', callout: 'Ø25 H7 (25.000/25.025)' };

beforeAll(async () => {
	({ clients, outsiderTeam } = await roleClients());
});

async function ruleFindings(actor: Actor, path: string, query = '') {
	const answer = await clients[actor].api('GET', `${path}/findings?kind=rule${query}`);
	expect(answer.status).toBe(200);
	return answer.json();
}

describe('who may run the rulebook and change its team settings', () => {
	// Supplier quality may not run it (403 before anything is looked up); another team's
	// members get 404.
	const expected: Record<Actor, [check: number, teamGet: number, teamPatch: number]> = {
		signedOut: [401, 401, 401],
		admin: [200, 200, 200],
		drafter: [403, 200, 403],
		checker: [200, 200, 403],
		quality: [403, 200, 403],
		outsider: [404, 404, 404]
	};
	for (const actor of actors) {
		it(actor, async () => {
			const { path } = await draftRevision(clients.drafter, 'kestrel');
			const client = clients[actor];
			const check = await client.api('POST', `${path}/check`);
			const team = await client.api('GET', '/teams/kestrel');
			const { version, allowSelfApproval } = await (
				await clients.admin.api('GET', '/teams/kestrel')
			).json();
			const patch = await client.api('PATCH', '/teams/kestrel', { version, allowSelfApproval });
			expect([check.status, team.status, patch.status]).toEqual(expected[actor]);
			if (check.status === 200) {
				expect(await check.json()).toMatchObject({ total: 0, open: 0, notes: [] });
			}
		});
	}
});

describe('rule findings through the API', () => {
	it('a feature write raises the finding; a check answers the summary and adds nothing twice', async () => {
		const { path } = await draftRevision(clients.drafter, 'kestrel');
		const added = await clients.drafter.api('POST', `${path}/features`, wrongBore);
		expect(added.status).toBe(201);
		const [finding] = await ruleFindings('drafter', path);
		expect(finding).toMatchObject({
			kind: 'rule',
			rule: 'LIM-04',
			severity: 'major',
			waiver: null
		});
		expect(finding.text).toContain(
			'Numbers: stated 25.000–25.025, H7 at 25.000 gives 25.000–25.021 (ISO 286-2)'
		);
		expect(finding.text).toContain('Rule: /rules/LIM-04');

		for (let i = 0; i < 2; i++) {
			const check = await clients.checker.api('POST', `${path}/check`);
			expect(check.status).toBe(200);
			const summary = await check.json();
			expect(summary).toMatchObject({ total: 1, open: 1, waived: 0, closed: 0, notes: [] });
			expect(summary.bySeverity.major).toEqual({ open: 1, waived: 0, closed: 0 });
			expect(summary.byFamily.LIM).toEqual({ open: 1, waived: 0, closed: 0 });
		}
		expect(await ruleFindings('drafter', path)).toHaveLength(1);

		// A waiver needs its reason; then it counts as waived in the summary and the filters.
		const url = `${path}/findings/${finding.id}`;
		const bare = await clients.checker.api('PATCH', url, { waiver: { reason: ' ' }, version: 1 });
		expect(bare.status).toBe(400);
		const byDrafter = await clients.drafter.api('PATCH', url, {
			waiver: { reason: 'Agreed' },
			version: 1
		});
		expect(byDrafter.status).toBe(403);
		const waived = await clients.checker.api('PATCH', url, {
			waiver: { reason: 'Reamed to 25.025 by agreement' },
			version: 1
		});
		expect(waived.status).toBe(200);
		expect((await waived.json()).waiver).toMatchObject({ reason: 'Reamed to 25.025 by agreement' });
		expect(await ruleFindings('drafter', path, '&waived=true&family=LIM')).toHaveLength(1);
		expect(await ruleFindings('drafter', path, '&waived=false')).toHaveLength(0);
		const after = await (await clients.checker.api('POST', `${path}/check`)).json();
		expect(after).toMatchObject({ open: 0, waived: 1 });
		const badFamily = await clients.drafter.api('GET', `${path}/findings?family=XYZ`);
		expect(badFamily.status).toBe(400);
	});

	it("a team's severity and capability grade follow at once; bad settings change nothing", async () => {
		const outsider = clients.outsider;
		const created = await outsider.api('POST', `/teams/${outsiderTeam}/drawings`, {
			number: 'EP-1',
			title: 'Bore',
			units: 'mm',
			standard: 'iso-8015',
			generalTolerance: { kind: 'iso2768', linear: 'm' }
		});
		expect(created.status).toBe(201);
		const { path } = await (async () => {
			const form = new FormData();
			const { twoSheetPdf } = await import('../fixtures/pdfs');
			form.set(
				'file',
				new Blob([(await twoSheetPdf('EP-1')) as BlobPart], { type: 'application/pdf' })
			);
			const up = await outsider.send(
				'POST',
				`/teams/${outsiderTeam}/drawings/EP-1/revisions`,
				form
			);
			expect(up.status).toBe(201);
			return { path: `/teams/${outsiderTeam}/drawings/EP-1/revisions/A` };
		})();
		expect((await outsider.api('POST', `${path}/features`, wrongBore)).status).toBe(201);
		const settings = await (await outsider.api('GET', `/teams/${outsiderTeam}`)).json();
		for (const bad of [
			{ severityOverrides: { 'XYZ-01': 'major' } },
			{ severityOverrides: { 'LIM-04': 'urgent' } },
			{ capabilityGrade: 'IT99' }
		]) {
			const refused = await outsider.api('PATCH', `/teams/${outsiderTeam}`, {
				...bad,
				version: settings.version
			});
			expect(refused.status, JSON.stringify(bad)).toBe(400);
		}
		const changed = await outsider.api('PATCH', `/teams/${outsiderTeam}`, {
			severityOverrides: { 'LIM-04': 'critical' },
			capabilityGrade: 'IT5',
			version: settings.version
		});
		expect(changed.status).toBe(200);
		expect(await changed.json()).toMatchObject({
			severityOverrides: { 'LIM-04': 'critical' },
			capabilityGrade: 'IT5',
			version: settings.version + 1
		});
		const stale = await outsider.api('PATCH', `/teams/${outsiderTeam}`, {
			capabilityGrade: null,
			version: settings.version
		});
		expect(stale.status).toBe(409);
		const findings = await (await outsider.api('GET', `${path}/findings?kind=rule`)).json();
		// IT5 over 18 up to 30 mm is 9 µm (ISO 286-1:2010 table 1): 0.025 is not tighter.
		expect(
			findings.map((f: { rule: string; severity: string }) => `${f.rule} ${f.severity}`)
		).toEqual(['LIM-04 critical']);
		const trail = await (await outsider.api('GET', `/teams/${outsiderTeam}/activity`)).json();
		expect(trail.map((a: { summary: string }) => a.summary)).toContain(
			"changed the team's rulebook settings"
		);
	});
});
