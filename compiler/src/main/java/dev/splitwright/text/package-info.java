/**
 * Number text that is the same on every JDK from 17 on: the JDK's own float and double printing
 * changed in JDK 19, so everything that writes numbers into outputs goes through here.
 */
package dev.splitwright.text;
