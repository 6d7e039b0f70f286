package org.slackwater.demo;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Each file, dumped to CDL by the netCDF C library's ncdump (full float/double precision) and
 * rebuilt by its ncgen as a classic file, must come back byte for byte: NetCDF-Java wrote exactly the
 * classic format the C library writes. Needs the Debian package netcdf-bin; skipped without it.
 */
class NetcdfCLibraryRoundTripTest {

  private static boolean available(String tool) {
    for (String dir : System.getenv().getOrDefault("PATH", "").split(java.io.File.pathSeparator)) {
      if (Files.isExecutable(Path.of(dir, tool))) {
        return true;
      }
    }
    return false;
  }

  private static void exec(Path workDir, Path stdout, String... cmd) throws IOException, InterruptedException {
    ProcessBuilder pb = new ProcessBuilder(cmd).directory(workDir.toFile()).redirectErrorStream(stdout == null);
    if (stdout != null) {
      pb.redirectOutput(stdout.toFile());
    } else {
      pb.redirectOutput(workDir.resolve("tool.log").toFile());
    }
    Process p = pb.start();
    if (!p.waitFor(60, TimeUnit.SECONDS)) {
      p.destroyForcibly();
      throw new IOException(String.join(" ", cmd) + " timed out");
    }
    assertEquals(0, p.exitValue(), String.join(" ", cmd) + " failed");
  }

  @ParameterizedTest
  @ValueSource(strings = {"rainfall", "runoff", "water_temperature", "cloud_fraction", "turbidity", "chlorophyll"})
  void ncdumpThenNcgenReproducesTheFile(String name, @TempDir Path dir) throws Exception {
    assumeTrue(available("ncdump") && available("ncgen"), "netcdf-bin (ncdump, ncgen) is not installed");
    Path ours = SmallScenario.file(name + ".nc");
    Path cdl = dir.resolve(name + ".cdl");
    Path rebuilt = dir.resolve(name + ".ncgen.nc");
    exec(dir, cdl, "ncdump", "-p", "9,17", ours.toString());
    exec(dir, null, "ncgen", "-k", "classic", "-o", rebuilt.toString(), cdl.toString());
    assertArrayEquals(Files.readAllBytes(ours), Files.readAllBytes(rebuilt), name + " differs from ncgen's rebuild");
  }
}
