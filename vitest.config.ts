import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    environment: 'node',
    testTimeout: 60_000,
    hookTimeout: 120_000,
    // expect.poll's own default is 1 s: too short for a page on a loaded 2-core machine (a browser
    // test failed once on it with the solid sessions running beside). A poll only waits this long
    // when what it waits for is late; a passing poll returns at once.
    expect: { poll: { timeout: 10_000 } },
  },
});
