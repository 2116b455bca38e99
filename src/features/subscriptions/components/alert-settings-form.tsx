import { useState, type FormEvent } from 'react';
import { X } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { FieldError, inputClasses } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { RiskSwatch } from '../../../components/ui/risk-swatch';
import type { RiskLadder } from '../../../../shared/contracts/office';
import { isApiError } from '../../../lib/api-client';
import { useUpdateMySubscription } from '../api/update-my-subscription';
import type { Subscription } from '../api/subscription-schemas';
import { addEmail, formChanged, formFromSubscription, hazardChoices, payloadFromForm, removeEmail, toggled, type AlertSettingsForm } from '../utils/alert-settings';

interface AlertSettingsFormProps {
  subscription: Subscription;
  ladder: RiskLadder;
}

const legendClasses = 'mb-1.5 text-[13px] font-semibold text-ink';

/** Threshold, hazards, days and addresses; saved together with the version they were loaded from. */
export function AlertSettingsFormPanel({ subscription, ladder }: AlertSettingsFormProps) {
  const saved = formFromSubscription(subscription, ladder);
  const [form, setForm] = useState<AlertSettingsForm>(saved);
  const [loadedVersion, setLoadedVersion] = useState(subscription.version);
  const [newEmail, setNewEmail] = useState('');
  const [emailProblem, setEmailProblem] = useState<string | null>(null);
  const update = useUpdateMySubscription();

  // A save elsewhere (or here) brings a new version: start again from the server's values.
  if (subscription.version !== loadedVersion) {
    setLoadedVersion(subscription.version);
    setForm(saved);
  }

  const changed = formChanged(form, saved);
  const stale = isApiError(update.error) && update.error.status === 409;

  const onAddEmail = () => {
    const result = addEmail(form.emails, newEmail);
    if (result.ok) {
      setForm({ ...form, emails: result.value });
      setNewEmail('');
      setEmailProblem(null);
    } else setEmailProblem(result.error);
  };

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    update.mutate(payloadFromForm(form, subscription.version));
  };

  return (
    <form onSubmit={onSubmit} className="space-y-5" aria-label="Alert settings">
      <fieldset>
        <legend className={legendClasses}>Alert threshold</legend>
        <p className="mb-2 text-[13px] text-ink-muted">We e-mail you when an outlook puts one of your areas at this level or higher.</p>
        <div className="grid gap-1.5 sm:grid-cols-2">
          {ladder.map((level) => (
            <label key={level.key} className="flex cursor-pointer items-center gap-2 rounded-md border border-line px-2 py-1.5 has-[:checked]:border-accent has-[:checked]:bg-accent-soft">
              <input type="radio" name="alertThreshold" value={level.key} checked={form.alertThreshold === level.key} onChange={() => setForm({ ...form, alertThreshold: level.key })} />
              <RiskSwatch label={level.label} colour={level.colour} />
              <span className="sr-only">{level.meaning}</span>
            </label>
          ))}
        </div>
      </fieldset>

      <fieldset>
        <legend className={legendClasses}>Hazards of interest</legend>
        <p className="mb-2 text-[13px] text-ink-muted">Leave all unticked to hear about every hazard.</p>
        <div className="flex flex-wrap gap-x-4 gap-y-1.5">
          {hazardChoices.map((choice) => (
            <label key={choice.key} className="flex items-center gap-1.5 text-sm">
              <input type="checkbox" checked={form.hazards.includes(choice.key)} onChange={() => setForm({ ...form, hazards: toggled(form.hazards, choice.key) })} />
              {choice.label}
            </label>
          ))}
        </div>
      </fieldset>

      <fieldset>
        <legend className={legendClasses}>Outlook days</legend>
        <div className="flex gap-4">
          {[1, 2, 3].map((day) => (
            <label key={day} className="flex items-center gap-1.5 text-sm">
              <input type="checkbox" checked={form.days.includes(day)} onChange={() => setForm({ ...form, days: toggled(form.days, day) })} />
              Day {day}
            </label>
          ))}
        </div>
        {form.days.length === 0 ? <FieldError>Choose at least one outlook day.</FieldError> : null}
      </fieldset>

      <fieldset>
        <legend className={legendClasses}>E-mail addresses (1 to 5)</legend>
        <ul className="mb-2 space-y-1">
          {form.emails.map((address) => (
            <li key={address} className="flex items-center justify-between gap-2 rounded-md bg-sunken px-2 py-1 text-sm">
              <span className="truncate">
                {address}
                {subscription.unconfirmedEmails.includes(address) ? <span className="ml-2 text-[12px] text-ink-muted">awaiting confirmation: nothing is sent here until the link we mailed is followed</span> : null}
              </span>
              <Button
                variant="ghost"
                size="sm"
                aria-label={`Remove ${address}`}
                onClick={() => {
                  const result = removeEmail(form.emails, address);
                  if (result.ok) {
                    setForm({ ...form, emails: result.value });
                    setEmailProblem(null);
                  } else setEmailProblem(result.error);
                }}
              >
                <X aria-hidden className="size-3.5" />
              </Button>
            </li>
          ))}
        </ul>
        <div className="flex gap-2">
          <label className="sr-only" htmlFor="new-alert-email">
            Another e-mail address
          </label>
          <input
            id="new-alert-email"
            type="email"
            className={inputClasses}
            placeholder="duty-officer@county.example"
            value={newEmail}
            onChange={(event) => setNewEmail(event.target.value)}
            onKeyDown={(event) => {
              if (event.key === 'Enter') {
                event.preventDefault();
                onAddEmail();
              }
            }}
          />
          <Button variant="secondary" onClick={onAddEmail}>
            Add address
          </Button>
        </div>
        {emailProblem ? <FieldError>{emailProblem}</FieldError> : null}
      </fieldset>

      {stale ? (
        <Notice tone="warning" title="Your settings changed in another window">
          Reload the page to see the latest settings, then make your change again.
        </Notice>
      ) : update.isError ? (
        <Notice tone="error" title="Your settings were not saved">
          {update.error.message}
        </Notice>
      ) : null}
      {update.isSuccess && !changed ? <Notice tone="success">Settings saved.</Notice> : null}

      <div className="flex items-center gap-3">
        <Button type="submit" busy={update.isPending} disabled={!changed || form.days.length === 0}>
          Save settings
        </Button>
        {changed ? <span className="text-[13px] text-ink-muted">You have unsaved changes.</span> : null}
      </div>
    </form>
  );
}
