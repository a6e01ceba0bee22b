/** Network-document builders for tests and scripts (no test-runner import). */
export type El = {
	id: string;
	type: string;
	nodes: (string | number)[];
	value?: string | number;
	control?: string;
};

export function net(elements: El[], output: string, input = 'Vin', reference?: string) {
	return {
		schema: 1 as const,
		elements,
		input,
		output: reference ? { node: output, reference } : { node: output }
	};
}

export const el = (
	id: string,
	type: string,
	nodes: (string | number)[],
	value?: string | number,
	control?: string
): El => ({
	id,
	type,
	nodes,
	...(value !== undefined ? { value } : {}),
	...(control ? { control } : {})
});
