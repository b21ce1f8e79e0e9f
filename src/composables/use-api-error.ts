import { useMessage, useNotification } from 'naive-ui';
import { apiErrorText, fieldErrors } from '@/lib/api-error-words';

/**
 * Shows failed calls the same way everywhere: short problems as a message, anything the user
 * might want to read twice as a notification. Must be called inside setup (naive-ui providers).
 */
export function useApiError() {
  const message = useMessage();
  const notification = useNotification();

  /** Shows the error; `action` names what failed ("Saving the note"). */
  function show(error: unknown, action?: string): void {
    const text = apiErrorText(error);
    if (action) {
      notification.error({ title: `${action} failed`, content: text, duration: 8000, keepAliveOnHover: true });
    } else {
      message.error(text, { duration: 6000 });
    }
  }

  return { show, text: apiErrorText, fieldErrors };
}
