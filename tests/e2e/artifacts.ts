// Files a browser test leaves for people to look at (screenshots, a printed PDF's pages). They
// go into Playwright's output folder for this test — under `npm test`, inside the run's own
// temporary folder, which is removed when the run ends — never loose into /tmp.
import { test } from '@playwright/test';

/** Path for an artifact of the running test. */
export const artifact = (name: string): string => test.info().outputPath(name);
