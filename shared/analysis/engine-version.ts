/** Version of the analysis rules; any change that can alter a result changes it. */
export const ENGINE_VERSION = '2.4.0';
