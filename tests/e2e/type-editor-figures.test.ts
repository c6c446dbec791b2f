import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { e2eDatabase } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { deskContext, deskPost } from '../setup/kiosk-steps';
import { demoTypes } from '@shared/demo/demo-types';
import { LimitsVersion } from '@server/db/models';
import type { AircraftTypeDefinition } from '@shared/schemas/limits';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe('figures on the type editor in German', () => {
  it('when engineering edits a type on a German screen, then figures read with a decimal comma, what a reading needs is in words, a figure it cannot read is refused in German, and the draft keeps what was typed', async () => {
    e2eDatabase();
    const engineering = await deskContext(browser, '7401', 'desk-engineering');
    const desk = engineering.page;
    // A type of this test's own, copied from the demo RX-4 (invented demo figures: the system 1 minimum mark is
    // 5.5 L), so the demo type other tests fly is never changed.
    const rx4 = demoTypes.find((t) => t.code === 'RX-4')!;
    const code = `RXD-${Math.random().toString(36).slice(2, 6).toUpperCase()}`;
    const created = await deskPost(desk, '/api/types', {
      code,
      name: `Komma ${code}`,
      definition: { ...structuredClone(rx4), code, name: `Komma ${code}` },
    });
    const typeId = created.id as number;
    expect((await deskPost(desk, `/api/types/${typeId}/draft/publish`)).version).toBe(1);

    await desk.goto(`/desk/types/${typeId}?lang=de`);
    await desk.getByRole('heading', { name: new RegExp(code) }).waitFor();
    await desk.getByRole('button', { name: /^System 1 reservoir level/, expanded: false }).click();
    const minimum = desk.getByLabel('Minimum-Marke');
    expect(await minimum.inputValue()).toBe('5,5');
    // What a reading must carry is named in words, never by its key.
    expect(await desk.getByLabel('Umgebungstemperatur').first().isVisible()).toBe(true);
    expect(await desk.getByText('ambientTempC').count()).toBe(0);

    await minimum.fill('5,2');
    const alert = desk.getByLabel('Verbrauchswarnung, L pro Flugstunde');
    await alert.fill('viel');
    await desk.getByRole('button', { name: 'Entwurf speichern' }).click();
    await desk.getByText('Geben Sie eine Zahl an, z. B. 3,5.').first().waitFor();
    expect(await LimitsVersion.count({ where: { typeId, status: 'draft' } })).toBe(0);
    // What was typed stays on the screen while the refused figure is mended.
    expect(await minimum.inputValue()).toBe('5,2');

    await alert.fill('0,4');
    await desk.getByRole('button', { name: 'Entwurf speichern' }).click();
    await expect.poll(() => LimitsVersion.count({ where: { typeId, status: 'draft' } })).toBe(1);
    const draft = (await LimitsVersion.findOne({ where: { typeId, status: 'draft' } }))!;
    const definition = JSON.parse(draft.definition) as AircraftTypeDefinition;
    expect(definition.consumptionAlertLPerFh).toBe(0.4);
    expect(definition.checkpoints.find((c) => c.code === 'sys1.level')!.marks!.minimum).toBe(5.2);
    await engineering.context.close();
  });
});
