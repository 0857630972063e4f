/**
 * The folder of the built program (dist/node/), where its worker scripts are, when this code
 * runs from the build; undefined when it runs from the sources (tsx, the tests). The build
 * (app/node-build.js) replaces this module with one that gives the folder.
 */
export const BUILT_DIR: URL | undefined = undefined;
