// Used by jest-expo (babel-jest); Metro applies the same preset when no file exists.
module.exports = function (api) {
  api.cache(true);
  return { presets: ['babel-preset-expo'] };
};
