/** Why an API key's secret is shown only once. */
export const KEY_SECRET_WARNING =
  'Meltwire stores only a hash of it. Once you close this dialog, nobody can show it again — not even an admin.';
