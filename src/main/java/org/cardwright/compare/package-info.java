/**
 * Comparing two diode cards the way a designer would: the parameters side by side, and the behaviour that
 * matters, simulated by one engine for both cards: forward voltage at each decade of current at each
 * temperature, reverse leakage, small-signal capacitance at a few biases, breakdown voltage. Every difference is
 * flagged against stated tolerances.
 */
package org.cardwright.compare;
