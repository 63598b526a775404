import { useFocusWhenClosed } from '../../../components/ui/focus';
import { useState } from 'react';
import type { InfantDetail } from '@shared/schemas/infants';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { usePhoneText } from '../../../lib/phone-text';
import { ContactsEditor } from './contacts-editor';

type Contact = InfantDetail['contacts'][number];

function consentWords(contact: Contact): string {
  const yes = [contact.consentSms && 'SMS', contact.consentEmail && 'e-mail'].filter(Boolean);
  return yes.length ? `Agrees to ${yes.join(' and ')}` : 'No reminders agreed';
}

function ContactItem({ contact }: { contact: Contact }) {
  const phoneText = usePhoneText();
  return (
    <li className="flex flex-col gap-1 rounded-xl border border-surface-200 p-3">
      <p className="font-bold text-ink-900">
        {contact.name} <span className="font-normal text-ink-700">({contact.relation})</span>
      </p>
      <dl className="grid grid-cols-1 gap-x-4 gap-y-0.5 text-sm sm:grid-cols-[10rem_minmax(0,1fr)]">
        <dt className="text-ink-500">Mobile</dt>
        <dd className="break-all text-ink-900">{contact.mobile ? phoneText(contact.mobile) : '—'}</dd>
        <dt className="text-ink-500">E-mail</dt>
        <dd className="break-all text-ink-900">{contact.email ?? '—'}</dd>
        <dt className="text-ink-500">Prefers</dt>
        <dd className="text-ink-900">{contact.preferredChannel === 'sms' ? 'SMS' : 'E-mail'}</dd>
        <dt className="text-ink-500">Reminders</dt>
        <dd className="text-ink-900">{consentWords(contact)}</dd>
        <dt className="text-ink-500">Language, time zone</dt>
        <dd className="text-ink-900">
          {contact.language}, {contact.timeZone}
        </dd>
      </dl>
    </li>
  );
}

export function ContactsSection({ infant, canEdit }: { infant: InfantDetail; canEdit: boolean }) {
  const [editing, setEditing] = useState(false);
  const editButton = useFocusWhenClosed<HTMLButtonElement>(editing);
  return (
    <Card
      title="Family contacts"
      actions={canEdit && !editing ? <Button ref={editButton} variant="secondary" size="sm" onClick={() => setEditing(true)}>Edit contacts</Button> : undefined}
    >
      {editing ? (
        <ContactsEditor infant={infant} onDone={() => setEditing(false)} />
      ) : infant.contacts.length === 0 ? (
        <EmptyState message="No family contacts recorded." />
      ) : (
        <ul className="grid grid-cols-1 gap-3">
          {infant.contacts.map((contact) => (
            <ContactItem key={contact.id} contact={contact} />
          ))}
        </ul>
      )}
    </Card>
  );
}
