import { DataTypes, type QueryInterface } from 'sequelize';

export async function up(qi: QueryInterface): Promise<void> {
  // A badge may name the language the kiosk switches to at its sign-in; empty means the tablet's own language.
  // A BCP 47 code of a shipped language (shared/i18n/languages.ts), checked by the staff API, not by the column.
  await qi.addColumn('staff', 'preferred_language', {
    type: DataTypes.STRING(16),
    allowNull: true,
    defaultValue: null,
  });
}
