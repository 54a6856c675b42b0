/**
 * JMH benchmarks: the cost of one prediction by the generated classifier against the in-memory
 * model and Weka's trees, and the cost of training against Weka, plus the post-processor that turns
 * JMH's JSON into the published Markdown table. Nothing depends on this package; it is the only
 * place besides tests where Weka (GPL) appears.
 */
package dev.splitwright.bench;
