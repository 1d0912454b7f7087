import { ROLE_LABELS, type UserDto } from '../../shared/api';
import type { Mailer } from './mailer';

export interface WelcomeMail {
  /** Sends in the background: a mail server that is down never undoes the new account. */
  send(user: UserDto, createdBy: string): void;
  /** Resolves when every mail started so far has been handed over (or has failed and been logged). */
  settled(): Promise<void>;
}

/** The mail a new user gets: who made the account, their roles, where to sign in. */
export function createWelcomeMail(mailer: Mailer, publicUrl: string): WelcomeMail {
  const pending = new Set<Promise<unknown>>();
  return {
    send(user, createdBy) {
      const roles = user.roles.map((role) => ROLE_LABELS[role]).join(', ');
      const delivery = mailer
        .send({
          to: user.email,
          subject: 'Your Bellkeep account is ready',
          text: [
            `Hello ${user.name},`,
            '',
            `${createdBy} has made you a Bellkeep account with the roles: ${roles}.`,
            `Sign in at ${publicUrl}/sign-in with this e-mail address; your admin gives you the password.`,
            '',
            'Bellkeep keeps the verdicts of the lab’s Bell-test runs.',
          ].join('\n'),
        })
        .catch((error: unknown) => console.error(`Welcome mail to ${user.email} failed:`, error))
        .finally(() => pending.delete(delivery));
      pending.add(delivery);
    },
    async settled() {
      await Promise.all([...pending]);
    },
  };
}
