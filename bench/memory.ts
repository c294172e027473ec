import { readFileSync, writeFileSync } from 'node:fs';

const field = (pid: number, name: string) => {
	const line = readFileSync(`/proc/${pid}/status`, 'utf8')
		.split('\n')
		.find((l) => l.startsWith(`${name}:`));
	return Number(line?.split(/\s+/)[1] ?? 0) * 1024;
};

export const rssBytes = (pid: number) => field(pid, 'VmRSS');

/** Resets the kernel's peak-RSS mark (VmHWM) so the next peak is this run's own. */
export function resetPeak(pid: number) {
	try {
		writeFileSync(`/proc/${pid}/clear_refs`, '5');
	} catch {
		// not permitted: the peak then includes start-up, which only overstates growth
	}
}

export const peakGrowth = (pid: number, baseline: number) => field(pid, 'VmHWM') - baseline;
