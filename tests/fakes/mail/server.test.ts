import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import nodemailer from 'nodemailer';
import { startMailFake, type MailFake } from '../../../fakes/mail/server';

// A small CSV attachment, sent as bytes and read back byte for byte.
const csv = Buffer.from('item,qty\nwhole milk 1 l,12\noat drink 1 l,6\n', 'utf8');

describe('mail fake', () => {
  let fake: MailFake;
  beforeEach(async () => {
    fake = await startMailFake({ smtpPort: 0, httpPort: 0 });
  });
  afterEach(async () => {
    await fake.close();
  });

  function transport(auth = true) {
    return nodemailer.createTransport({
      host: '127.0.0.1',
      port: fake.smtpPort,
      secure: false,
      ignoreTLS: true,
      ...(auth ? { auth: { user: 'anyone', pass: 'anything' } } : {}),
    });
  }

  it('receives a message with an attachment and shows it over HTTP JSON', async () => {
    const suffix = Math.random().toString(36).slice(2, 8);
    const subject = `Purchase order ${suffix}`;
    await transport().sendMail({
      from: 'orders@hillside-roastery.test',
      to: ['buyer@corner-cup.test', 'books@corner-cup.test'],
      subject,
      text: 'Please find the order attached.',
      html: '<p>Please find the order <b>attached</b>.</p>',
      attachments: [{ filename: 'order.csv', content: csv, contentType: 'text/csv' }],
    });

    const arrived = await fake.waitForMessage((m) => m.subject === subject, 5000);
    expect(arrived.from).toBe('orders@hillside-roastery.test');
    expect(arrived.to).toEqual(['buyer@corner-cup.test', 'books@corner-cup.test']);
    expect(arrived.attachments).toHaveLength(1);
    expect(arrived.attachments[0].content.equals(csv)).toBe(true);

    const list = await fetch(`${fake.httpUrl}/api/messages`).then((r) => r.json());
    expect(list.messages).toHaveLength(1);
    expect(list.messages[0].subject).toBe(subject);

    const one = await fetch(`${fake.httpUrl}/api/messages/${arrived.id}`).then((r) => r.json());
    expect(one.message.text.trim()).toBe('Please find the order attached.');
    expect(one.message.html).toContain('<b>attached</b>');
    expect(one.message.attachments[0]).toMatchObject({ filename: 'order.csv', contentType: 'text/csv', size: csv.length });

    const file = await fetch(`${fake.httpUrl}${one.message.attachments[0].url}`);
    expect(file.status).toBe(200);
    expect(file.headers.get('content-disposition')).toBe('attachment; filename="order.csv"');
    expect(Buffer.from(await file.arrayBuffer()).equals(csv)).toBe(true);

    const page = await fetch(`${fake.httpUrl}/`).then((r) => r.text());
    expect(page).toContain(`href="/messages/${arrived.id}"`);
    const read = await fetch(`${fake.httpUrl}/messages/${arrived.id}`).then((r) => r.text());
    expect(read).toContain('order.csv');
  });

  it('accepts mail without a login, lists newest first and clears over HTTP', async () => {
    await transport(false).sendMail({ from: 'a@corner-cup.test', to: 'b@corner-cup.test', subject: 'first', text: '1' });
    await transport(false).sendMail({ from: 'a@corner-cup.test', to: 'b@corner-cup.test', subject: 'second', text: '2' });
    expect(fake.messages().map((m) => m.subject)).toEqual(['second', 'first']);

    const del = await fetch(`${fake.httpUrl}/api/messages`, { method: 'DELETE' });
    expect(del.status).toBe(204);
    expect(fake.messages()).toEqual([]);
    const missing = await fetch(`${fake.httpUrl}/api/messages/nope`);
    expect(missing.status).toBe(404);
  });

  it('rejects a wait that times out', async () => {
    await expect(fake.waitForMessage(() => true, 100)).rejects.toThrow('No matching mail arrived within 100 ms');
  });
});
