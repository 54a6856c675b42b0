/**
 * Checks generated Java source from inside the JVM: compiles it in memory ({@link
 * dev.splitwright.check.InMemoryCompiler}), loads the classes in a fresh class loader ({@link
 * dev.splitwright.check.CompiledClasses}), measures the class files ({@link
 * dev.splitwright.check.ClassFileInfo}) and compares a candidate function with an oracle ({@link
 * dev.splitwright.check.OracleComparison}).
 *
 * <p>Depends on the JDK only, so it knows nothing about trees or data sets.
 */
package dev.splitwright.check;
