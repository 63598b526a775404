/**
 * Languages a family contact may name. Those with message templates come first (messages go out in them); the
 * others are languages families in the programme's area commonly speak at home (common practice, chosen by the
 * team), recorded so staff can arrange an interpreter; their messages go out in English until templates exist.
 */
export const OTHER_HOME_LANGUAGES = [
  'ar', 'bn', 'cy', 'de', 'fa', 'fr', 'gu', 'hi', 'it', 'ku', 'lt', 'pa', 'pl', 'ps', 'pt', 'ro', 'ru', 'so', 'ta', 'ti', 'tr', 'uk', 'ur', 'zh',
] as const;
