// The tempo engine's version, stored with every analysis it makes. Raise it whenever a change to the engine
// changes what it reports: the server then re-analyses, in the background, every recording analysed by an
// older version (corrections the player made are kept).
export const ENGINE_VERSION = 5;
