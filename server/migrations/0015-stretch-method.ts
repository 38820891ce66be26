// How the player stretches time for this person (shared/schemas.ts StretchMethod): the phase vocoder unless they
// choose overlap-add in Account (README, "Playback and stretch").
import { DataTypes, type QueryInterface } from 'sequelize';

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('users', 'stretchMethod', {
    type: DataTypes.ENUM('phase-vocoder', 'overlap-add'),
    allowNull: false,
    defaultValue: 'phase-vocoder',
  });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('users', 'stretchMethod');
}
