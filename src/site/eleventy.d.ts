// Eleventy ships no type declarations; these cover the parts scatterbook uses.
declare module '@11ty/eleventy' {
  export interface UserConfig {
    setLibrary(name: string, lib: unknown): void;
    addGlobalData(name: string, value: unknown): void;
    addTransform(name: string, transform: (content: string, outputPath: string) => string): void;
    addPassthroughCopy(paths: string | Record<string, string>): void;
    addWatchTarget(path: string): void;
    setServerOptions(options: Record<string, unknown>): void;
    setQuietMode(quiet: boolean): void;
    on(event: string, fn: (...args: unknown[]) => unknown): void;
  }
  export interface EleventyOptions {
    quietMode?: boolean;
    configPath?: string;
    runMode?: 'build' | 'serve' | 'watch';
    loader?: 'esm' | 'cjs' | 'auto';
    config?: (config: UserConfig) => void;
    pathPrefix?: string;
  }
  export default class Eleventy {
    constructor(input?: string, output?: string, options?: EleventyOptions);
    init(): Promise<void>;
    write(): Promise<unknown>;
    watch(): Promise<void>;
    serve(port?: number): Promise<void>;
    stopWatch(): Promise<void>;
    setIsVerbose(verbose: boolean): void;
  }
}
