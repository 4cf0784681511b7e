/** How the server's messages and the audit log name a share's audience ("shared for council review"). */
export const AUDIENCE_WORDS = { council: 'for council review', public: 'for public comment' } as const;
