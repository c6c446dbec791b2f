import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import type { Browser } from 'playwright-core';
import { e2eDatabase } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { deskContext, deskPost } from '../setup/kiosk-steps';
import { starterCard } from '@shared/domain/starter-card';
import { LimitsVersion } from '@server/db/models';
import type { AircraftTypeDefinition } from '@shared/schemas/limits';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe('a leak-rate checkpoint made on the type editor', () => {
  it('when engineering adds a checkpoint and makes it a leak rate, then it counts drops/min from 0 with static and dynamic bands and publishes', async () => {
    e2eDatabase();
    const engineering = await deskContext(browser, '7401', 'desk-engineering');
    const desk = engineering.page;
    const code = `LK-${randomUUID().slice(0, 4).toUpperCase()}`;
    const created = await deskPost(desk, '/api/types', {
      code,
      name: `Leak test ${code}`,
      definition: starterCard(code, `Leak test ${code}`),
    });
    const typeId = created.id as number;
    expect((await deskPost(desk, `/api/types/${typeId}/draft/publish`)).version).toBe(1);
    await desk.goto(`/desk/types/${typeId}`);
    await desk.getByRole('heading', { name: new RegExp(code) }).waitFor();

    await desk.getByRole('button', { name: 'Add checkpoint' }).click();
    await desk.getByLabel(/e\.g\. sys1\.level/).fill('sys1.leaks');
    await desk.getByLabel(/^Label\b/).fill('Pump leaks');
    await desk.getByLabel('Instruction on the kiosk').fill('Count the drops at the pump for one minute.');
    await desk.getByLabel('Reference in the approved data').fill('Approved maintenance data, test chapter');
    await desk.getByLabel(/^Kind/).selectOption({ label: 'leak rate (drops/min)' });
    // The strict start: no leak in limits, any leak out of limits, for a static and for a dynamic leak.
    await expect.poll(() => desk.getByLabel('Only for a leak that is').count()).toBe(4);
    expect(await desk.getByLabel(/^Range max/).inputValue()).toBe('60');
    await desk.getByRole('button', { name: 'Save draft' }).click();
    await desk.getByRole('button', { name: 'Publish draft as v2' }).click();
    await desk.getByText('Version 2 published').waitFor();

    const v2 = await LimitsVersion.findOne({ where: { typeId, version: 2 } });
    const leak = (JSON.parse(v2!.definition) as AircraftTypeDefinition).checkpoints.find(
      (c) => c.code === 'sys1.leaks',
    );
    expect(leak).toMatchObject({ kind: 'leak_rate', unit: null, range: { min: 0, max: 60 } });
    expect(leak!.bands.map((b) => [b.id, b.verdict, b.when?.leakState])).toEqual([
      ['static_none', 'in_limits', 'static'],
      ['static_leak', 'out_of_limits', 'static'],
      ['dynamic_none', 'in_limits', 'dynamic'],
      ['dynamic_leak', 'out_of_limits', 'dynamic'],
    ]);
    await engineering.context.close();
  });
});
