import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Where the engineer placed the stamp block on page 1 of a revision's plan: the lower-left corner
 * of its outline in the page's display frame, in points ({"x": …, "y": …}). Null: the desk puts
 * it in the emptiest corner (or on a cover sheet when page 1 has none). Fixed once the revision's
 * return is requested, like the decision.
 */
export class StampPlacement1764723000000 implements MigrationInterface {
  name = 'StampPlacement1764723000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE revisions ADD COLUMN stamp_placement jsonb`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE revisions DROP COLUMN stamp_placement`);
  }
}
