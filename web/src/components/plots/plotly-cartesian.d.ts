// The cartesian partial bundle ships no types: it is plotly.js with fewer trace types, so it takes plotly.js's.
declare module 'plotly.js-cartesian-dist-min' {
  import Plotly from 'plotly.js';
  export default Plotly;
}
