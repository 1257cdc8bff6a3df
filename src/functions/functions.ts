/**
 * Webpack entry of the worksheet functions bundle (dist/functions.js), loaded by the shared
 * runtime page in Excel and by the headless evaluator. Each imported file declares its
 * `@customfunction`s; the build appends their `CustomFunctions.associate` calls to that file.
 * This bundle must never import HyperFormula or anything from Node (it runs in the host).
 */
import "./beam-functions";
import "./load-functions";
import "./envelope-functions";
