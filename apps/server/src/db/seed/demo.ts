import type { Sequelize } from 'sequelize';
import { Organization } from '../models/index.js';

/**
 * The demo scenario: an invented consultancy, Brackenridge Ground & Damp, whose site is
 * brackenridge-ground.example. Idempotent: running it again changes nothing that exists.
 * Returns the lines `npm start` prints.
 */
export async function seedDemo(sequelize: Sequelize): Promise<string> {
  return sequelize.transaction(async (transaction) => {
    const [org] = await Organization.findOrCreate({
      where: { slug: 'brackenridge-ground' },
      defaults: { name: 'Brackenridge Ground & Damp', slug: 'brackenridge-ground' },
      transaction,
    });
    return `demo organisation: ${org.name} (id ${org.id})`;
  });
}
