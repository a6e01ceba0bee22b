// The places a new comment can point at, built from the latest revision and its analysis:
// the whole sheet, each part, each net, each pole and zero, each reactive part's time constant,
// and the headline figures (spec lines).
import type { ResultAnchors } from './sheet-review.svelte';
import type { Anchor } from './types';

export interface AnchorOption {
	key: string;
	label: string;
	group: string;
	anchor: Anchor;
}

const hz = (f: number) => (f >= 1e6 ? `${(f / 1e6).toPrecision(3)} MHz` : f >= 1e3 ? `${(f / 1e3).toPrecision(3)} kHz` : `${f.toPrecision(3)} Hz`);
export const SPEC_LINES = [
	['bandwidth', 'Bandwidth'],
	['dcGain', 'DC gain'],
	['riseTime', 'Rise time'],
	['overshoot', 'Overshoot'],
	['inputImpedance', 'Input impedance']
] as const;

export const anchorKey = (a: Anchor) => (a.kind === 'sheet' ? 'sheet' : `${a.kind}:${a.ref}`);

export function anchorOptions(r: ResultAnchors | null): AnchorOption[] {
	const out: AnchorOption[] = [{ key: 'sheet', label: 'The whole sheet', group: 'Sheet', anchor: { kind: 'sheet' } }];
	if (!r) return out;
	for (const e of r.elements) out.push({ key: `element:${e.id}`, label: `${e.id} (${e.type})`, group: 'Parts', anchor: { kind: 'element', ref: e.id } });
	for (const n of r.nets) out.push({ key: `net:${n}`, label: `net ${n}`, group: 'Nets', anchor: { kind: 'net', ref: n } });
	r.poles.forEach((p, i) => {
		const owners = p.owners.filter((o) => o.share >= 0.2).map((o) => o.element);
		out.push({
			key: `pole:p${i + 1}`,
			label: `p${i + 1} — ${hz(p.hz)}${owners.length ? `, set by ${owners.join(', ')}` : ''}`,
			group: 'Poles',
			anchor: { kind: 'pole', ref: `p${i + 1}`, snapshot: { re: p.re, im: p.im, hz: p.hz, owners } }
		});
	});
	r.zeros.forEach((z, i) => out.push({ key: `zero:z${i + 1}`, label: `z${i + 1} — ${hz(z.hz)}`, group: 'Zeros', anchor: { kind: 'zero', ref: `z${i + 1}`, snapshot: { re: z.re, im: z.im, hz: z.hz } } }));
	// Time constants belong to ports (parallel capacitors are one port, named "Ca + Cb").
	const ports = r.ports ?? r.elements.filter((x) => x.reactive).map((e) => e.id);
	for (const id of ports) out.push({ key: `time_constant:${id}`, label: `τ of ${id}`, group: 'Time constants', anchor: { kind: 'time_constant', ref: id } });
	for (const [ref, label] of SPEC_LINES) out.push({ key: `spec:${ref}`, label, group: 'Figures', anchor: { kind: 'spec', ref, snapshot: { label } } });
	return out;
}
