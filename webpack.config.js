/* Build of the three surfaces: the Excel bundle (task pane + functions, one shared runtime page),
   and the headless `loadpath` command for Node. The functions metadata (functions.json) is
   generated from the @customfunction JSDoc of the files listed in FUNCTION_SOURCES. */
const path = require("path");
const fs = require("fs");
const webpack = require("webpack");
const HtmlWebpackPlugin = require("html-webpack-plugin");
const CopyWebpackPlugin = require("copy-webpack-plugin");
const CustomFunctionsMetadataPlugin = require("custom-functions-metadata-plugin");

/** Every file holding @customfunction declarations. */
const FUNCTION_SOURCES = ["./src/functions/beam-functions.ts", "./src/functions/load-functions.ts", "./src/functions/envelope-functions.ts"].filter((f) =>
  fs.existsSync(path.resolve(__dirname, f)),
);

/** Entry of the demo page (the pane over the in-memory workbook, with a sample building). */
const DEMO_ENTRY = "./src/taskpane-demo/demo.ts";
/** The sample building the demo page opens, turned into JSON at build time. */
const DEMO_SAMPLE = process.env.LOADPATH_DEMO_SAMPLE || "sample-workbooks/steel-office-us.xlsx";
/** The SI sample building, opened by pane-demo.html?sample=timber. */
const DEMO_SAMPLE_SI = "sample-workbooks/timber-house-si.xlsx";
/** The two-storey SI sample (continuous joists, walls), opened by pane-demo.html?sample=two-storey. */
const DEMO_SAMPLE_TWO_STOREY = "sample-workbooks/two-storey-house-si.xlsx";

const DEV_URL = "https://localhost:3000/";
const PROD_URL = process.env.LOADPATH_URL || "https://localhost:3000/";

const tsRule = {
  test: /\.tsx?$/,
  exclude: /node_modules/,
  use: { loader: "ts-loader", options: { transpileOnly: true, compilerOptions: { sourceMap: true } } },
};

async function devServerOptions(mode) {
  if (mode !== "development") return undefined;
  let https = {};
  try {
    // office-addin-dev-certs installs a local CA trusted by Office; without it the browser falls back
    // to webpack's self-signed certificate.
    https = await require("office-addin-dev-certs").getHttpsServerOptions();
  } catch {
    https = {};
  }
  return {
    static: { directory: path.resolve(__dirname, "dist") },
    headers: { "Access-Control-Allow-Origin": "*" },
    server: { type: "https", options: https },
    port: Number(process.env.npm_package_config_dev_server_port || 3000),
  };
}

module.exports = async (env, argv) => {
  const mode = argv.mode || "production";
  const web = {
    name: "addin",
    mode,
    devtool: "source-map",
    target: ["web", "es2020"],
    entry: {
      functions: "./src/functions/functions.ts",
      taskpane: "./src/taskpane/taskpane.ts",
    },
    output: {
      path: path.resolve(__dirname, "dist"),
      filename: "[name].js",
      clean: false,
    },
    resolve: { extensions: [".ts", ".tsx", ".js"] },
    module: { rules: [tsRule] },
    performance: { hints: false },
    plugins: [
      new CustomFunctionsMetadataPlugin({ input: FUNCTION_SOURCES, output: "functions.json" }),
      // One page hosts the shared runtime: the task pane and the functions.
      new HtmlWebpackPlugin({
        filename: "taskpane.html",
        template: "./src/taskpane/taskpane.html",
        chunks: ["functions", "taskpane"],
        inject: "body",
        scriptLoading: "blocking",
      }),
      new CopyWebpackPlugin({
        patterns: [
          { from: "assets/*", to: "assets/[name][ext]", noErrorOnMissing: true },
          {
            from: "manifest.xml",
            to: "manifest.xml",
            transform: (content) => (mode === "production" ? content.toString().split(DEV_URL).join(PROD_URL) : content),
          },
        ],
      }),
    ],
    devServer: await devServerOptions(mode),
  };
  const cli = {
    name: "cli",
    mode,
    devtool: "source-map",
    target: "node20",
    entry: { cli: "./src/cli/main.ts" },
    output: {
      path: path.resolve(__dirname, "dist"),
      filename: "[name].js",
      library: { type: "commonjs2" },
    },
    resolve: { extensions: [".ts", ".js"] },
    module: { rules: [tsRule] },
    // Libraries stay in node_modules; only our code is bundled.
    externals: [({ request }, callback) => (/^[a-z@][^:]*$/i.test(request) && !request.startsWith(".") ? callback(null, "commonjs " + request) : callback())],
    performance: { hints: false },
    optimization: { minimize: false },
  };
  // The pane outside Excel (dist/pane-demo.html) over the in-memory workbook: its own build, so
  // HyperFormula never enters the bundle Excel loads. It loads dist/functions.js at run time, as
  // Excel does. Node built-ins imported by the headless modules (used only from Node) are empty here.
  const demo = {
    name: "demo",
    mode,
    devtool: "source-map",
    target: ["web", "es2020"],
    entry: { "pane-demo": DEMO_ENTRY },
    output: { path: path.resolve(__dirname, "dist"), filename: "[name].js", clean: false },
    resolve: { extensions: [".ts", ".tsx", ".js"], fallback: { fs: false, path: false, vm: false } },
    module: { rules: [tsRule] },
    performance: { hints: false },
    plugins: [
      // The memory port builds engines through headless.ts, which reads dist/ from disk; in the page
      // the stand-in builds them from the bundle the page registered.
      new webpack.NormalModuleReplacementPlugin(/^\.\/headless$/, (resource) => {
        if (/src[\\/]workbook$/.test(resource.context)) resource.request = path.resolve(__dirname, "src/taskpane-demo/headless-browser.ts");
      }),
      new webpack.NormalModuleReplacementPlugin(/^node:/, (resource) => {
        resource.request = resource.request.replace(/^node:/, "");
      }),
      new HtmlWebpackPlugin({
        filename: "pane-demo.html",
        template: "./src/taskpane-demo/pane-demo.html",
        chunks: ["pane-demo"],
        inject: "body",
        scriptLoading: "blocking",
      }),
      new CopyWebpackPlugin({
        patterns: [
          fs.existsSync(path.resolve(__dirname, DEMO_SAMPLE))
            ? {
                from: DEMO_SAMPLE,
                to: "samples/takedown-sample.json",
                transform: { transformer: (content) => require("./src/taskpane-demo/sample-json.cjs").xlsxToJson(content), cache: false },
              }
            : { from: "src/taskpane-demo/demo-building.json", to: "samples/takedown-sample.json" },
          ...(fs.existsSync(path.resolve(__dirname, DEMO_SAMPLE_SI))
            ? [
                {
                  from: DEMO_SAMPLE_SI,
                  to: "samples/takedown-sample-si.json",
                  transform: { transformer: (content) => require("./src/taskpane-demo/sample-json.cjs").xlsxToJson(content), cache: false },
                },
              ]
            : []),
          ...(fs.existsSync(path.resolve(__dirname, DEMO_SAMPLE_TWO_STOREY))
            ? [
                {
                  from: DEMO_SAMPLE_TWO_STOREY,
                  to: "samples/takedown-sample-two-storey.json",
                  transform: { transformer: (content) => require("./src/taskpane-demo/sample-json.cjs").xlsxToJson(content), cache: false },
                },
              ]
            : []),
        ],
      }),
    ],
  };
  const withDemo = fs.existsSync(path.resolve(__dirname, DEMO_ENTRY)) ? [demo] : [];
  return fs.existsSync(path.resolve(__dirname, "src/cli/main.ts")) ? [web, cli, ...withDemo] : [web, ...withDemo];
};
