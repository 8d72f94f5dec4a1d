import type { Knex } from 'knex';

// Self-contained: never import app code into a migration. The default texts below are ours and
// are copied here on purpose (a later change to the app's wording must not change this file).

const CLOSING = `Our help is free and there is no obligation of any kind. The club has no authority over you or your equipment: where rules on radio interference apply, your national regulator decides what counts and what must be done, not us. We simply hope to sort it out together, neighbour to neighbour.

You can tell us how you would like to go on through this page (no account needed, it takes a minute):
{{responseLink}}

Or write to {{clubContactEmail}} and mention {{caseReference}}.

Kind regards,
{{senderName}}
for the interference committee of {{clubName}}`;

const WHAT_AND_WHO = `What is radio interference? Many ordinary electrical devices switch current on and off thousands of times a second. A little of that energy leaks out through their cables and the house wiring as weak radio waves. It is harmless to people and does not mean the device is dangerous, but it can cover faint radio signals for a few hundred metres around.

Everyday devices that often do this:
- plug-in chargers and switch-mode power supplies (laptops, phones, routers, e-bikes)
- LED lamps and their drivers, dimmable ones especially
- solar panel inverters and home batteries
- aquarium or pond heaters and pumps
- doorbell transformers and older security lights`;

const TRY = `Simple things you could try, only if you are willing:
- A switch-off test: turn devices off one at a time, or switch off one circuit at the fuse box for a minute, while one of us listens nearby. We can agree a time with you.
- Move or replace a charger or power supply: a cheap unbranded one is a frequent source.
- Clip a ferrite choke (a small snap-on ring) onto the cable close to the device. We are glad to bring a few.`;

const NOTE_AND_REPORTER = `{{#personalNote}}
{{personalNote}}

{{/personalNote}}
{{#reporterName}}
{{reporterName}}, one of our members, first noticed the noise and agreed that we may tell you their name.

{{/reporterName}}`;

const DEFAULT_TEMPLATES = [
  {
    key: 'first-notice',
    title: 'First notice',
    subject: 'A friendly note from {{clubName}} about radio reception near you',
    body: `Dear {{recipientName}},

We are volunteers from {{clubName}}, a local radio club. Some of our members listen to faint radio signals, and for a while a buzz, hiss or warble has been covering them in your part of town. We followed the noise from the street with small hand-held receivers, and a device near you may be where it comes from. If so, you are very probably unaware of it: most households are.

${WHAT_AND_WHO}

${TRY}

${NOTE_AND_REPORTER}
${CLOSING}`,
  },
  {
    key: 'follow-up',
    title: 'Follow-up',
    subject: 'Following up: radio reception near you ({{caseReference}})',
    body: `Dear {{recipientName}},

On {{firstNoticeDate}} we wrote to you about a radio noise that a device near you may be making. We have not heard back yet, which is completely fine: letters get lost and days get busy. We are writing once more in case our first note did not reach you.

${WHAT_AND_WHO}

${TRY}

${NOTE_AND_REPORTER}
${CLOSING}`,
  },
  {
    key: 'thank-you',
    title: 'Thank-you',
    subject: 'Thank you from {{clubName}}',
    body: `Dear {{recipientName}},

Thank you for your help with the radio noise we wrote to you about ({{caseReference}}). It makes a real difference to our members, and we are grateful for the time you gave it.

If the noise ever comes back, or if you would like a few ferrite chokes for other devices, we are glad to help, free of charge.

{{#personalNote}}
{{personalNote}}

{{/personalNote}}
You can still reach us through this page:
{{responseLink}}

Or write to {{clubContactEmail}}.

With warm thanks,
{{senderName}}
for the interference committee of {{clubName}}`,
  },
  {
    key: 'utility-referral',
    title: 'Utility referral',
    subject: 'Radio noise near you may come from the power lines ({{caseReference}})',
    body: `Dear {{recipientName}},

We are volunteers from {{clubName}}, a local radio club, following up a radio noise in your area. Our listening from the street suggests it may come from power line hardware near you rather than from anything in your home. Nothing needs to be done by you.

Worn or loose hardware on poles can spark in a way you cannot see, and the small sparks make radio noise. Only the electricity network operator may inspect or repair it; please do not go near the hardware yourself. We have passed our notes to them, or will do so shortly.

${NOTE_AND_REPORTER}
The club has no authority in this matter: the network operator and, where rules apply, the national regulator decide what is done. If you have noticed a buzzing pole or flickering street lights, we would be glad to hear about it through this page:
{{responseLink}}

Or write to {{clubContactEmail}} and mention {{caseReference}}.

Kind regards,
{{senderName}}
for the interference committee of {{clubName}}`,
  },
];

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('notice_templates', (t) => {
    t.text('key').primary();
    t.text('title').notNullable();
    t.text('subject').notNullable();
    t.text('body').notNullable();
    t.integer('version').notNullable().defaultTo(1);
    t.uuid('updated_by').nullable().references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
    t.check("key in ('first-notice','follow-up','thank-you','utility-referral')", [], 'notice_templates_key_check');
  });
  await knex('notice_templates').insert(DEFAULT_TEMPLATES);

  await knex.schema.createTable('notices', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('case_id').notNullable().references('cases.id').onDelete('CASCADE');
    t.text('template_key').notNullable().references('notice_templates.key');
    t.text('status').notNullable().defaultTo('draft');
    t.text('recipient_name').notNullable();
    t.text('postal_address').notNullable();
    // Lower-case letters and digits of the address, single-spaced: one household, one key.
    t.text('address_key').notNullable();
    t.text('email').nullable();
    t.text('personal_note').notNullable().defaultTo('');
    t.uuid('created_by').nullable().references('users.id').onDelete('SET NULL');
    t.uuid('approved_by').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('approved_at', { useTz: true }).nullable();
    // What was approved: the template texts and the placeholder values, frozen at approval.
    t.jsonb('frozen').nullable();
    // The response link is derived (HMAC of id and nonce with a server secret); only its hash is stored.
    t.text('token_nonce').nullable();
    t.text('token_hash').nullable().unique();
    t.timestamp('token_expires_at', { useTz: true }).nullable();
    t.timestamp('sent_at', { useTz: true }).nullable();
    t.date('delivered_on').nullable();
    t.uuid('follow_up_of').nullable().references('notices.id').onDelete('SET NULL');
    t.timestamp('reminder_checked_at', { useTz: true }).nullable();
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.check(
      "status in ('draft','approved','queued','sent','failed','hand-delivered','cancelled')",
      [],
      'notices_status_check',
    );
    t.index(['case_id']);
    t.index(['address_key']);
  });
  // One household, one active notice per case (sent and hand-delivered ones leave room for a follow-up).
  await knex.raw(`CREATE UNIQUE INDEX notices_one_active_per_household ON notices (case_id, address_key)
    WHERE status IN ('draft','approved','queued','failed')`);
  // A notice gets at most one follow-up.
  await knex.raw('CREATE UNIQUE INDEX notices_one_follow_up ON notices (follow_up_of) WHERE follow_up_of IS NOT NULL');

  await knex.schema.createTable('notice_answers', (t) => {
    t.bigIncrements('id').primary();
    t.uuid('notice_id').notNullable().references('notices.id').onDelete('CASCADE');
    t.text('kind').notNullable();
    t.text('message').notNullable().defaultTo('');
    t.text('contact').notNullable().defaultTo('');
    // SHA-256 of the client address: enough to rate-limit, not enough to identify anyone.
    t.text('client_hash').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check("kind in ('will-check','not-mine','contact-me','fixed-it','other')", [], 'notice_answers_kind_check');
    t.index(['notice_id', 'created_at']);
    t.index(['client_hash', 'created_at']);
  });

  await knex.schema.createTable('outbox', (t) => {
    t.bigIncrements('id').primary();
    t.text('kind').notNullable(); // notice | alert
    t.uuid('notice_id').nullable().references('notices.id').onDelete('CASCADE');
    t.uuid('case_id').nullable().references('cases.id').onDelete('CASCADE');
    t.text('idempotency_key').notNullable().unique();
    // Generated once when queued; every (re)send carries it so mail systems can drop a repeat.
    t.text('message_id').notNullable().unique();
    t.text('to_address').notNullable();
    // Alerts are stored rendered; notices are rendered from their frozen text at delivery time.
    t.text('subject').nullable();
    t.text('text_body').nullable();
    t.text('html_body').nullable();
    t.text('status').notNullable().defaultTo('pending');
    t.integer('attempts').notNullable().defaultTo(0);
    t.timestamp('next_attempt_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('lease_until', { useTz: true }).nullable();
    t.text('leased_by').nullable();
    t.text('last_error').nullable();
    t.timestamp('last_attempt_at', { useTz: true }).nullable();
    t.timestamp('sent_at', { useTz: true }).nullable();
    // Set once the notice and case have been updated after the server accepted the message.
    t.boolean('effects_applied').notNullable().defaultTo(false);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check("kind in ('notice','alert')", [], 'outbox_kind_check');
    t.check("status in ('pending','sent','failed')", [], 'outbox_status_check');
    t.check("kind = 'alert' or notice_id is not null", [], 'outbox_notice_has_id');
  });
  await knex.raw("CREATE UNIQUE INDEX outbox_one_row_per_notice ON outbox (notice_id) WHERE kind = 'notice'");
  await knex.raw("CREATE INDEX outbox_due ON outbox (next_attempt_at, id) WHERE status = 'pending'");
  await knex.raw("CREATE INDEX outbox_effects_pending ON outbox (id) WHERE status = 'sent' AND NOT effects_applied");
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('outbox');
  await knex.schema.dropTableIfExists('notice_answers');
  await knex.schema.dropTableIfExists('notices');
  await knex.schema.dropTableIfExists('notice_templates');
}
