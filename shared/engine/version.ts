/** Version of the design engine; frozen revisions record it. Bump the minor on any change of results. */
export const ENGINE_VERSION = '1.7.0'
