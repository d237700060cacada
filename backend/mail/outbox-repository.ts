import type { Knex } from 'knex';

export interface OutboxMessage {
  id: number;
  at: string;
  to: string;
  subject: string;
  text: string;
  template: string;
}

export function createOutboxRepository(knex: Knex) {
  return {
    async add(message: Omit<OutboxMessage, 'id'>): Promise<void> {
      await knex('mail_outbox').insert(message);
    },
    async list(limit: number, to?: string): Promise<OutboxMessage[]> {
      const q = knex('mail_outbox').orderBy('id', 'desc').limit(limit);
      if (to) q.where({ to: to.toLowerCase() });
      return q;
    },
  };
}
export type OutboxRepository = ReturnType<typeof createOutboxRepository>;
