/** The outcome of an action: a status line when it worked, an alert when it did not. */
import type { ReactNode } from 'react';

export interface NoticeMessage {
  ok: boolean;
  text: string;
}

export function Notice({
  message,
  children,
}: {
  message: NoticeMessage | null;
  children?: ReactNode;
}) {
  if (!message) return null;
  return (
    <p
      role={message.ok ? 'status' : 'alert'}
      className={`text-sm ${message.ok ? 'text-teal' : 'text-stressed'}`}
    >
      {message.text} {children}
    </p>
  );
}
