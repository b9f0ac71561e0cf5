import { db } from '@/models';
import { saveCalculation } from '@/lib/calculations/records';
import { demoActor } from './20261201000100-demo-users';
import { demoProject } from './20261201000300-demo-scenario';

export const name = '20261202000200-demo-calculations';

/*
 * Saved calculations of the invented TW-7 cabinet project, from the seeded templates (the louvre
 * calculation flagged by the withdrawn louvre version is saved by the demo scenario before the withdrawal).
 */
export async function up(): Promise<void> {
  const engineer = await demoActor('engineer@demo.example');
  const author = await demoActor('author@demo.example');
  const project = await demoProject();
  const { Calculation } = db();
  if (await Calculation.findOne({ where: { projectId: project.id, title: 'Door panel heat loss in a 4 m/s wind' } })) return;
  await saveCalculation({ actor: engineer, tokenId: null, request: {
    project: project.id, title: 'Door panel heat loss in a 4 m/s wind', note: 'summer design point',
    template: { slug: 'flat-plate-forced-convection-air' },
    inputs: { T_inf: { value: 38, unit: 'degC' }, T_s: { value: 52, unit: 'degC' }, p: { value: 1, unit: 'atm' }, u_inf: 4, L: { value: 1.1, unit: 'm' }, W: { value: 0.7, unit: 'm' } },
  } });
  await saveCalculation({ actor: engineer, tokenId: null, request: {
    project: project.id, title: 'Side wall free convection, still air', note: 'no wind, night',
    template: { slug: 'vertical-plate-free-convection-air' },
    inputs: { T_inf: { value: 20, unit: 'degC' }, T_s: { value: 31, unit: 'degC' }, p: { value: 1, unit: 'atm' }, H: 1.6, W: 0.8 },
  } });
  await saveCalculation({ actor: author, tokenId: null, request: {
    project: project.id, title: 'Rectifier cold plate channel', note: 'one of four parallel channels',
    template: { slug: 'tube-water-heating-uniform-flux' },
    inputs: { m_dot: 0.04, D: { value: 8, unit: 'mm' }, L: 0.9, T_in: { value: 30, unit: 'degC' }, T_out: { value: 36, unit: 'degC' } },
  } });
  await saveCalculation({ actor: engineer, tokenId: null, request: {
    project: project.id, title: 'Door panel heat loss over the wind speed range', note: 'parametric: 1 to 16 m/s',
    template: { slug: 'flat-plate-forced-convection-air' },
    rows: [1, 2, 4, 6, 8, 10, 12, 16].map((u) => ({ T_inf: { value: 38, unit: 'degC' }, T_s: { value: 52, unit: 'degC' }, p: { value: 1, unit: 'atm' }, u_inf: u, L: 1.1, W: 0.7 })),
  } });
}

export async function down(): Promise<void> {
  const project = await demoProject();
  await db().Calculation.destroy({ where: { projectId: project.id, title: ['Door panel heat loss in a 4 m/s wind', 'Side wall free convection, still air', 'Rectifier cold plate channel', 'Door panel heat loss over the wind speed range'] } });
}
