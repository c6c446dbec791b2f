import { DataTypes, type QueryInterface } from 'sequelize';

export async function up(qi: QueryInterface): Promise<void> {
  // A tablet belongs to a base: its airframe list shows that base's airframes first. Null: not placed yet.
  await qi.addColumn('kiosk_devices', 'base_id', {
    type: DataTypes.INTEGER.UNSIGNED,
    allowNull: true,
    references: { model: 'bases', key: 'id' },
    onDelete: 'RESTRICT',
  });
  // A board link may show one base or a list of bases; a link with no rows here shows every base.
  await qi.createTable('board_link_bases', {
    board_link_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      primaryKey: true,
      references: { model: 'board_links', key: 'id' },
      onDelete: 'CASCADE',
    },
    base_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      primaryKey: true,
      references: { model: 'bases', key: 'id' },
      onDelete: 'RESTRICT',
    },
  });
}
