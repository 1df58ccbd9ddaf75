/** Version of the reduction engine, recorded with every result (bump on any change of numbers). */
export const ENGINE_VERSION = '2.0.0';
