import { Client, DEMO_PASSWORD, signedIn, signUp } from '../../support/http-client';

// Shared helpers of the security suite: one signed-in client per demo role, and throwaway
// accounts for requests that change or remove something.

export const ACTORS = ['anonymous', 'member', 'editor', 'librarian', 'admin'] as const;
export type Actor = (typeof ACTORS)[number];

export const demoEmail: Record<Exclude<Actor, 'anonymous'>, string> = {
  member: 'member@candlewise.test',
  editor: 'editor@candlewise.test',
  librarian: 'librarian@candlewise.test',
  admin: 'admin@candlewise.test',
};

let counter = 0;
export const unique = (prefix = 'x') => `${prefix}-${process.pid}-${Date.now().toString(36)}-${(counter++).toString(36)}`;

export interface Account {
  id: string;
  email: string;
  password: string;
  client: Client;
}

export class Fixtures {
  private clients = new Map<Actor, Promise<Client>>();
  private cache = new Map<string, Promise<unknown>>();
  constructor(readonly base: string) {}

  /** The long-lived client of an actor (anonymous has no cookies). */
  client(actor: Actor): Promise<Client> {
    let c = this.clients.get(actor);
    if (!c) {
      c = actor === 'anonymous' ? Promise.resolve(new Client(this.base)) : signedIn(this.base, demoEmail[actor]);
      this.clients.set(actor, c);
    }
    return c;
  }

  /**
   * A new client signed in as a spare account of the actor's role, for requests that end the
   * session they run in (sign-out ends every session of the account, so not the demo ones).
   */
  async freshClient(actor: Actor): Promise<Client> {
    if (actor === 'anonymous') return new Client(this.base);
    const spare = await this.once(`spare:${actor}`, async () => {
      const acc = await this.newMember(`spare-${actor}`);
      if (actor !== 'member') {
        const r = await (await this.client('admin')).json(`/api/users/${acc.id}`, 'PATCH', { role: actor });
        if (r.status !== 200) throw new Error(`could not make a spare ${actor}: ${r.status}`);
      }
      return acc;
    });
    const c = new Client(this.base);
    if (!(await c.signIn(spare.email, spare.password)).ok) throw new Error(`spare ${actor} could not sign in`);
    return c;
  }

  /** Computed once per run and shared by the files of this suite that import it in one worker. */
  once<T>(key: string, make: () => Promise<T>): Promise<T> {
    let p = this.cache.get(key) as Promise<T> | undefined;
    if (!p) {
      p = make();
      this.cache.set(key, p);
    }
    return p;
  }

  /** A new member account, signed in. */
  async newMember(prefix = 'sec'): Promise<Account> {
    const email = `${unique(prefix)}@candlewise.test`;
    const password = 'riverside-moss-and-stone';
    const { id, client } = await signUp(this.base, { name: 'Security Test', email, password });
    return { id, email, password, client };
  }

  async userId(actor: Exclude<Actor, 'anonymous'>): Promise<string> {
    return this.once(`id:${actor}`, async () => (await (await this.client(actor)).session()).user!.id);
  }
}

export { Client, DEMO_PASSWORD };
