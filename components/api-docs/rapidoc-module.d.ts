// rapidoc ships no types: importing it only registers the <rapi-doc> custom element.
declare module "rapidoc";
