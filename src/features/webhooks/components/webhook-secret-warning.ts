/** Why a webhook signing secret is shown only once. */
export const WEBHOOK_SECRET_WARNING =
  'Store it with your receiver: it verifies the webhook-signature header of each delivery (Standard Webhooks). Once you close this dialog the console cannot show it again; if it is lost, rotate the secret.';
