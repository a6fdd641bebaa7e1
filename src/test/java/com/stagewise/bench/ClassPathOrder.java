package com.stagewise.bench;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.net.MalformedURLException;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.file.Path;
import java.util.Locale;

/**
 * Loads one class through a fresh class loader over the given jars, in the given order, and prints
 * the main thread's processor time and the wall time it took in milliseconds: what a class path's
 * order costs the first class found in a jar late on it (each jar before it is opened and
 * searched). Run it in a JVM of its own per order, alternated (DEVELOPERS.md, "The plain jar's own
 * start"): {@code java -cp target/test-classes com.stagewise.bench.ClassPathOrder
 * com.fasterxml.jackson.core.JsonFactory target/lib/A.jar target/lib/B.jar …}
 */
public final class ClassPathOrder {

  private ClassPathOrder() {}

  public static void main(String[] args) throws ClassNotFoundException, MalformedURLException {
    if (args.length < 2) {
      System.err.println("usage: ClassPathOrder CLASS JAR…");
      System.exit(2);
    }
    URL[] urls = new URL[args.length - 1];
    for (int i = 1; i < args.length; i++) {
      urls[i - 1] = Path.of(args[i]).toUri().toURL();
    }
    ThreadMXBean threads = ManagementFactory.getThreadMXBean();
    URLClassLoader loader = new URLClassLoader(urls, null);
    long cpu = threads.getCurrentThreadCpuTime();
    long wall = System.nanoTime();
    Class.forName(args[0], false, loader);
    long cpuTaken = threads.getCurrentThreadCpuTime() - cpu;
    long wallTaken = System.nanoTime() - wall;
    System.out.printf(
        Locale.ROOT, "processor %.1f ms, wall %.1f ms%n", cpuTaken / 1e6, wallTaken / 1e6);
  }
}
