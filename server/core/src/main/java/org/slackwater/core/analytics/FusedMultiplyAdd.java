package org.slackwater.core.analytics;

/**
 * Whether the JVM compiles {@link Math#fma} to the processor's fused multiply-add. Where it does,
 * the kernels use it (one instruction and one rounding per step instead of two, and a shorter
 * chain of dependent additions); where it does not, Math.fma is emulated in software, far too
 * slow, and they multiply and add. A static final flag, so the JIT keeps only the chosen branch.
 */
final class FusedMultiplyAdd {
  static final boolean AVAILABLE = detect();

  private FusedMultiplyAdd() {}

  private static boolean detect() {
    try {
      com.sun.management.HotSpotDiagnosticMXBean vm = java.lang.management.ManagementFactory.getPlatformMXBean(
          com.sun.management.HotSpotDiagnosticMXBean.class);
      return vm != null && Boolean.parseBoolean(vm.getVMOption("UseFMA").getValue());
    } catch (RuntimeException | LinkageError e) {
      return false; // not a HotSpot JVM, or no such option: multiply and add, always correct
    }
  }
}
