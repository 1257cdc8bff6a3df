/* Build of the three surfaces: the Excel bundle (task pane + functions, one shared runtime page),
   and the headless `loadpath` command for Node. The functions metadata (functions.json) is
   generated from the @customfunction JSDoc of the files listed in FUNCTION_SOURCES. */
const path = require("path");
const fs = require("fs");
const HtmlWebpackPlugin = require("html-webpack-plugin");
const CopyWebpackPlugin = require("copy-webpack-plugin");
const CustomFunctionsMetadataPlugin = require("custom-functions-metadata-plugin");

/** Every file holding @customfunction declarations. */
const FUNCTION_SOURCES = ["./src/functions/beam-functions.ts", "./src/functions/load-functions.ts"].filter((f) =>
  fs.existsSync(path.resolve(__dirname, f)),
);

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
  return fs.existsSync(path.resolve(__dirname, "src/cli/main.ts")) ? [web, cli] : [web];
};
