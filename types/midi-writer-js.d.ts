// midi-writer-js ships types, but its package.json "exports" hides them from TypeScript's resolver.
declare module 'midi-writer-js' {
  import main from 'midi-writer-js/build/types/main';
  export default main;
}
