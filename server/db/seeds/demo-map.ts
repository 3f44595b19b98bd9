/**
 * The demo firm's map set-up: its home area is Crawford County, WI (where the demo farms lie), so a
 * newly added demo property's map opens there. Imagery stays off: the demo works with no network.
 */
import type { Transaction } from 'sequelize';
import type { Firm } from '../../models';

/** Crawford County, WI as a box [west, south, east, north] (U.S. Census Bureau via us-atlas, rounded outward). */
export const DEMO_HOME_AREA = { name: 'Crawford County, WI', bbox: [-91.21, 42.98, -90.66, 43.43] as [number, number, number, number] };

/** Sets the demo firm's home area unless it chose one already. */
export async function seedDemoMap(firm: Firm, transaction: Transaction): Promise<void> {
  const settings = (firm.settings ?? {}) as Record<string, unknown>;
  if (settings.homeArea) return;
  await firm.update({ settings: { ...settings, homeArea: DEMO_HOME_AREA } }, { transaction });
}
