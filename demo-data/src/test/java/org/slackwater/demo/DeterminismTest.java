package org.slackwater.demo;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Same options, same bytes: small() generated twice must give identical SHA-256 (FIPS 180-4) digests. */
class DeterminismTest {

  @Test
  void smallTwiceGivesIdenticalFiles(@TempDir Path a, @TempDir Path b) throws Exception {
    DemoManifest first = DemoScenario.generate(a, DemoOptions.small());
    DemoScenario.generate(b, DemoOptions.small());
    Map<String, String> da = digests(a);
    Map<String, String> db = digests(b);
    assertEquals(first.allFiles().size(), da.size(), "every manifest file exists and nothing else was written");
    assertEquals(da, db);
  }

  @Test
  void anotherSeedGivesOtherData(@TempDir Path a, @TempDir Path b) throws Exception {
    DemoOptions s = DemoOptions.small();
    DemoScenario.generate(a, s);
    DemoScenario.generate(b, new DemoOptions(s.firstYear(), s.lastYear(), s.resolutionDivisor(), s.seed() + 1));
    // The map is fixed, the weather is not: the rain must differ while the regions stay the same.
    assertNotEquals(digests(a).get("rainfall.nc"), digests(b).get("rainfall.nc"));
    assertEquals(digests(a).get(DemoScenario.REGIONS), digests(b).get(DemoScenario.REGIONS));
  }

  @Test
  void sha256MatchesTheFips180ExampleSoTheComparisonMeansSomething() throws NoSuchAlgorithmException {
    // FIPS 180-4 / NIST example: SHA-256("abc").
    byte[] d = MessageDigest.getInstance("SHA-256").digest("abc".getBytes(java.nio.charset.StandardCharsets.US_ASCII));
    assertEquals("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad", HexFormat.of().formatHex(d));
  }

  static Map<String, String> digests(Path dir) throws IOException, NoSuchAlgorithmException {
    Map<String, String> out = new TreeMap<>();
    List<Path> files;
    try (Stream<Path> s = Files.list(dir)) {
      files = s.sorted().toList();
    }
    for (Path p : files) {
      MessageDigest md = MessageDigest.getInstance("SHA-256");
      try (InputStream in = Files.newInputStream(p)) {
        byte[] buf = new byte[1 << 16];
        int n;
        while ((n = in.read(buf)) > 0) {
          md.update(buf, 0, n);
        }
      }
      out.put(p.getFileName().toString(), HexFormat.of().formatHex(md.digest()));
    }
    return out;
  }
}
