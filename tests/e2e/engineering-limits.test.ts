import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { e2eDatabase, enrolledKiosk, makeMechanicAndAirframe } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { deskContext, deskPost, kioskSignIn, preFlight } from '../setup/kiosk-steps';
import { demoTypes } from '@shared/demo/demo-types';
import { AircraftType, Check, LimitsVersion, Reading } from '@server/db/models';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** Opens a check's full record on the desk, checks the limits version it names, and gives its system 1 row. */
async function recordJudgedAgainst(desk: Page, checkId: string, version: string) {
  await desk.goto(`/desk/records/${checkId}`);
  await desk.getByText('Judged against').waitFor();
  const named = await desk.locator('dd').filter({ hasText: version }).textContent();
  expect(named).toContain(`${version} (published`);
  return desk.getByRole('row').filter({ hasText: 'System 1 reservoir level' });
}

describe('limits under version control', () => {
  it('when engineering publishes a new limits version, then a new check is judged by it while an old check still shows the old one', async () => {
    e2eDatabase();
    const demoRx4 = (await AircraftType.findOne({ where: { code: 'RX-4' } }))!;
    const demoRx4Versions = async () =>
      (await LimitsVersion.findAll({ where: { typeId: demoRx4.id }, order: [['id', 'ASC']] })).map((v) => [
        v.id,
        v.status,
        v.definition,
      ]);
    const demoRx4Before = await demoRx4Versions();
    const { badge, pin, airframe } = await makeMechanicAndAirframe();
    const engineering = await deskContext(browser, '7401', 'desk-engineering');
    const desk = engineering.page;

    // A type of this test's own, copied from the demo RX-4, so the demo RX-4 other tests use is never changed.
    // Demo figures (shared/demo/demo-types.ts, invented for the demo): system 1 on wheels is in limits from the
    // 5.5 L minimum mark to the 7.0 L normal mark; from above the 3 L isolation level to below 5.5 L is "service".
    const code = `RXV-${airframe.fleetNumber.slice(2)}`;
    const rx4 = demoTypes.find((t) => t.code === 'RX-4')!;
    const created = await deskPost(desk, '/api/types', {
      code,
      name: `Versioned ${code}`,
      definition: { ...structuredClone(rx4), code, name: `Versioned ${code}` },
    });
    const typeId = created.id as number;
    const v1 = await deskPost(desk, `/api/types/${typeId}/draft/publish`);
    expect(v1.version).toBe(1);
    await airframe.update({ typeId });

    // The first pre-flight, system 1 at 5.2 L: below the v1 minimum, so "service".
    const kiosk = await enrolledKiosk(browser);
    const mechanic = await kiosk.newPage();
    await kioskSignIn(mechanic, badge, pin);
    expect(await preFlight(mechanic, airframe.fleetNumber, pin, 5.2)).toBe('service');
    expect(await mechanic.getByTestId('check-result').textContent()).toContain(`${code} limits v1`);
    expect(
      await mechanic.getByTestId('result-sys1.level').getByTestId('verdict').getAttribute('data-verdict'),
    ).toBe('service');
    const [oldCheck] = await Check.findAll({ where: { airframeId: airframe.id } });
    expect(oldCheck!.limitsVersionId).toBe(v1.id);

    // Engineering moves the system 1 minimum from 5.5 L to 5.0 L on the type page and publishes v2 there.
    await desk.goto(`/desk/types/${typeId}`);
    await desk.getByRole('heading', { name: new RegExp(code) }).waitFor();
    await desk.getByRole('button', { name: /^System 1 reservoir level/, expanded: false }).click();
    const bandIds = desk.getByLabel('Band id');
    await expect.poll(() => bandIds.count()).toBe(6);
    const ids = await Promise.all([0, 1, 2, 3, 4, 5].map((i) => bandIds.nth(i).inputValue()));
    const at = (id: string) => {
      expect(ids).toContain(id);
      return ids.indexOf(id);
    };
    await desk.getByLabel('upper edge value').nth(at('below_minimum')).fill('5');
    await desk.getByLabel('lower edge value').nth(at('in_limits_wheels')).fill('5');
    await desk.getByLabel('lower edge value').nth(at('in_limits_jacks')).fill('5');
    await desk.getByLabel('minimum mark').fill('5');
    await desk.getByRole('button', { name: 'Save draft' }).click();
    const publish = desk.getByRole('button', { name: 'Publish draft as v2' });
    await publish.click();
    await desk.getByText('Version 2 published').waitFor();
    await expect
      .poll(() => desk.getByRole('row').filter({ hasText: 'v2' }).textContent())
      .toMatch(/published, in use/);
    expect(await desk.getByRole('row').filter({ hasText: 'v1' }).textContent()).toMatch(
      /published, superseded/,
    );
    const versions = await LimitsVersion.findAll({ where: { typeId }, order: [['version', 'ASC']] });
    expect(versions.map((v) => [v.version, v.status])).toEqual([
      [1, 'published'],
      [2, 'published'],
    ]);
    const v2Sys1 = (JSON.parse(versions[1]!.definition) as typeof rx4).checkpoints.find(
      (c) => c.code === 'sys1.level',
    )!;
    expect(v2Sys1.bands.find((b) => b.id === 'in_limits_wheels')!.lower).toEqual({ value: 5, closed: true });
    expect(v2Sys1.bands.find((b) => b.id === 'below_minimum')!.upper).toEqual({ value: 5, closed: false });

    // A new pre-flight at the same 5.2 L is judged by v2: in limits.
    await mechanic.goto('/kiosk/airframes');
    expect(await preFlight(mechanic, airframe.fleetNumber, pin, 5.2)).toBe('in_limits');
    expect(await mechanic.getByTestId('check-result').textContent()).toContain(`${code} limits v2`);

    const checks = await Check.findAll({ where: { airframeId: airframe.id }, order: [['signedAt', 'ASC']] });
    expect(checks).toHaveLength(2);
    expect(checks[0]!.id).toBe(oldCheck!.id);
    expect(checks[1]!.limitsVersionId).toBe(versions[1]!.id);
    expect(checks[1]!.limitsVersionId).not.toBe(checks[0]!.limitsVersionId);
    expect(checks.map((c) => c.verdict)).toEqual(['service', 'in_limits']);
    const sys1 = await Promise.all(
      checks.map((c) => Reading.findOne({ where: { checkId: c.id, checkpointCode: 'sys1.level' } })),
    );
    expect(sys1.map((r) => r!.value)).toEqual([expect.closeTo(5.2, 1), expect.closeTo(5.2, 1)]);
    expect(sys1.map((r) => [r!.verdict, r!.bandId])).toEqual([
      ['service', 'below_minimum'],
      ['in_limits', 'in_limits_wheels'],
    ]);

    // The old check's full record still says v1 and its old verdict.
    const oldRow = await recordJudgedAgainst(desk, oldCheck!.id, `${code} limits v1`);
    expect(await oldRow.getByTestId('verdict').getAttribute('data-verdict')).toBe('service');
    expect(await oldRow.textContent()).toContain('Level below the minimum mark.');
    const newRow = await recordJudgedAgainst(desk, checks[1]!.id, `${code} limits v2`);
    expect(await newRow.getByTestId('verdict').getAttribute('data-verdict')).toBe('in_limits');

    // The demo RX-4 the other browser tests fly is as it was.
    expect(await demoRx4Versions()).toEqual(demoRx4Before);

    for (const c of [kiosk, engineering.context]) await c.close();
  });
});
