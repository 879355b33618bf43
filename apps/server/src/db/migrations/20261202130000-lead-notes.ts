import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../migrator.js';

// An enquiry's notes become a dated list (who wrote what, when) instead of one box each save
// overwrote. The old box's text becomes the first note, dated when the lead was last updated.
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable(
    'lead_notes',
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      organization_id: {
        type: DataTypes.INTEGER.UNSIGNED,
        allowNull: false,
        references: { model: 'organizations', key: 'id' },
        onDelete: 'CASCADE',
        onUpdate: 'CASCADE',
      },
      lead_id: {
        type: DataTypes.INTEGER.UNSIGNED,
        allowNull: false,
        references: { model: 'leads', key: 'id' },
        // A purged or deleted lead takes its notes with it.
        onDelete: 'CASCADE',
        onUpdate: 'CASCADE',
      },
      author_user_id: {
        type: DataTypes.INTEGER.UNSIGNED,
        allowNull: true,
        references: { model: 'users', key: 'id' },
        onDelete: 'SET NULL',
        onUpdate: 'CASCADE',
      },
      body: { type: DataTypes.TEXT, allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
  // A lead's notes in order; the list page reads the notes of one page of leads.
  await qi.addIndex('lead_notes', ['lead_id', 'id'], { name: 'lead_notes_lead_id' });
  await qi.sequelize.query(
    `INSERT INTO lead_notes (organization_id, lead_id, author_user_id, body, created_at)
     SELECT organization_id, id, NULL, notes, updated_at FROM leads WHERE notes IS NOT NULL AND notes <> ''`,
    { type: QueryTypes.INSERT },
  );
  // Raw DDL with a type: Sequelize 6's removeColumn runs an untyped query that fails with the mariadb 3 connector.
  await qi.sequelize.query('ALTER TABLE leads DROP COLUMN notes', { type: QueryTypes.UPDATE });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE leads ADD COLUMN notes TEXT NULL', { type: QueryTypes.UPDATE });
  // The newest note is the one the old single box would have held.
  await qi.sequelize.query(
    `UPDATE leads l JOIN (SELECT lead_id, MAX(id) AS id FROM lead_notes GROUP BY lead_id) last ON last.lead_id = l.id
     JOIN lead_notes n ON n.id = last.id SET l.notes = n.body`,
    { type: QueryTypes.UPDATE },
  );
  await qi.dropTable('lead_notes');
};
