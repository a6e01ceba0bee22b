// The editor's keyboard map, shown in the help panel and documented in docs/editor.md.
export const SHORTCUTS: { keys: string; what: string }[] = [
	{ keys: 'Ctrl+Z', what: 'Undo' },
	{ keys: 'Ctrl+Shift+Z or Ctrl+Y', what: 'Redo' },
	{ keys: 'Delete or Backspace', what: 'Delete the selected parts and wires' },
	{ keys: 'Ctrl+C / Ctrl+X / Ctrl+V', what: 'Copy / cut / paste' },
	{ keys: 'Ctrl+D', what: 'Duplicate the selection' },
	{ keys: 'Ctrl+A', what: 'Select everything' },
	{
		keys: 'Ctrl+S',
		what: 'Mark a checkpoint in the history (saves first; name and message optional)'
	},
	{ keys: 'R', what: 'Turn the selection a quarter turn clockwise' },
	{ keys: 'M', what: 'Mirror the selection' },
	{
		keys: 'Tab',
		what: 'The canvas is one stop: Tab enters it at the part last used, and leaves it'
	},
	{ keys: 'Arrow keys', what: 'Go to the nearest part that way (it is selected)' },
	{ keys: 'Home / End', what: 'Go to the first / last part' },
	{ keys: 'Page Down / Page Up', what: 'Go to the next / previous part in reading order' },
	{ keys: 'Alt+arrow keys', what: 'Nudge the selection one grid step (Shift: four)' },
	{ keys: 'Enter', what: 'Edit the part’s value (Escape comes back to the part)' },
	{ keys: 'T', what: 'Go to the part’s terminals; arrow keys between them; T or Escape back' },
	{
		keys: 'Enter or Space on a terminal',
		what: 'Start a wire there; on a second terminal, end it'
	},
	{
		keys: 'N on a terminal',
		what: 'Join it to a net by name (gnd: ground; a new name places a net name)'
	},
	{ keys: 'Delete on a terminal', what: 'Remove the wires on that terminal' },
	{ keys: 'C', what: 'Comment on the part' },
	{ keys: 'Shift+drag', what: 'Select with a box' },
	{ keys: 'Shift+click', what: 'Add to or remove from the selection' },
	{ keys: 'F', what: 'Fit the drawing to the view' },
	{ keys: '+ / −', what: 'Zoom in / out (or the mouse wheel)' },
	{ keys: 'Escape', what: 'Cancel a wire being drawn; clear the selection; close this panel' },
	{ keys: '?', what: 'Show or hide this panel' }
];

export interface ShortcutTarget {
	undo(): void;
	redo(): void;
	remove(): void;
	copy(): void;
	cut(): void;
	paste(): void;
	duplicate(): void;
	selectAll(): void;
	rotate(): void;
	mirror(): void;
	fit(): void;
	zoomIn(): void;
	zoomOut(): void;
	clear(): void;
	help(): void;
}

/** Runs the shortcut for a key event; returns true when the event was used. */
export function runShortcut(e: KeyboardEvent, t: ShortcutTarget): boolean {
	const el = e.target as HTMLElement | null;
	if (
		el &&
		(el.closest('input, textarea, select, [contenteditable="true"]') || el.isContentEditable)
	)
		return false;
	const mod = e.ctrlKey || e.metaKey;
	const k = e.key.toLowerCase();
	const map: [boolean, () => void][] = [
		[mod && !e.shiftKey && k === 'z', t.undo],
		[mod && ((e.shiftKey && k === 'z') || k === 'y'), t.redo],
		[!mod && (e.key === 'Delete' || e.key === 'Backspace'), t.remove],
		[mod && k === 'c', t.copy],
		[mod && k === 'x', t.cut],
		[mod && k === 'v', t.paste],
		[mod && k === 'd', t.duplicate],
		[mod && k === 'a', t.selectAll],
		[!mod && !e.altKey && k === 'r', t.rotate],
		[!mod && !e.altKey && k === 'm', t.mirror],
		[!mod && !e.altKey && k === 'f', t.fit],
		[!mod && (e.key === '+' || e.key === '='), t.zoomIn],
		[!mod && (e.key === '-' || e.key === '−'), t.zoomOut],
		[e.key === 'Escape', t.clear],
		[e.key === '?', t.help]
	];
	const hit = map.find(([when]) => when);
	if (!hit) return false;
	e.preventDefault();
	hit[1]();
	return true;
}
