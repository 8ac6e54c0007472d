import { Button } from "./button";

/** A form's own message (the server's refusal, a lost connection), read out as soon as it shows. */
export function FormError({ message }: { message: string | null | undefined }) {
  return (
    <p role="alert" aria-live="assertive" className="min-h-6 font-semibold text-danger">
      {message}
    </p>
  );
}

/** A control's own refusal, under it (nothing while there is none). */
export function InlineError({ message }: { message: string | null | undefined }) {
  return message ? (
    <span role="alert" className="text-sm font-semibold text-danger">
      {message}
    </span>
  ) : null;
}

/** The foot of a one-button form: its message, then the full-width submit button (busy while sending). */
export function FormFooter({ error, submitting, label, busyLabel }: { error: string | null | undefined; submitting: boolean; label: string; busyLabel: string }) {
  return (
    <>
      <FormError message={error} />
      <Button type="submit" disabled={submitting} className="w-full">
        {submitting ? busyLabel : label}
      </Button>
    </>
  );
}
