package org.lagmill.training;

import com.fasterxml.jackson.core.JsonProcessingException;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.lagmill.io.SealedJson;
import org.lagmill.store.CorruptStoreException;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.StoreDirectories;

/**
 * A model directory that holds several members, each a complete model directory in its own sub-folder
 * ({@code member-1}, {@code member-2}, …), and {@code combination.json} (checksummed) listing them with the names the
 * user gave them. A forecast with it is the plain average of the members' forecasts (the forecast package's
 * {@code MemberAverage}), as the backtest scored it. Members train one after another, so the memory of training is
 * that of the largest member.
 */
public final class ModelCombination {
  public static final String FILE_NAME = "combination.json";
  public static final int FORMAT_VERSION_CURRENT = 1;

  private ModelCombination() {}

  /** One member: the name the user gave it (e.g. its spec file) and its sub-folder. */
  public record Member(String name, String folder) {}

  /** {@code combination.json}. */
  public record Manifest(int formatVersion, List<Member> members) {}

  /** Whether {@code dir} holds a combination rather than a single model. */
  public static boolean isCombination(Path dir) {
    return Files.isRegularFile(dir.resolve(FILE_NAME));
  }

  /** A folder holding a combination manifest that parses (checksums aside): one lagmill may replace. */
  static boolean looksLikeCombination(Path dir) {
    Path file = dir.resolve(FILE_NAME);
    if (!Files.isRegularFile(file)) {
      return false;
    }
    try {
      return ModelDirectory.JSON.readTree(file.toFile()).has("members");
    } catch (IOException e) {
      return false;
    }
  }

  /** Reads and checks {@code combination.json}. */
  public static Manifest readManifest(Path dir) throws IOException {
    Path file = dir.resolve(FILE_NAME);
    SealedJson.Unsealed unsealed = SealedJson.unseal(file, Files.readAllBytes(file));
    if (!unsealed.sealed()) {
      throw new CorruptStoreException(file, "expected the " + SealedJson.MEMBER + " member, actual none");
    }
    Manifest manifest;
    try {
      manifest = ModelDirectory.JSON.readValue(unsealed.bytes(), Manifest.class);
    } catch (JsonProcessingException e) {
      throw new CorruptStoreException(file, "not a valid combination manifest: " + e.getOriginalMessage(), e);
    }
    if (manifest.formatVersion() != FORMAT_VERSION_CURRENT) {
      throw new CorruptStoreException(file, "unsupported combination format version: expected "
          + FORMAT_VERSION_CURRENT + ", actual " + manifest.formatVersion());
    }
    if (manifest.members() == null || manifest.members().size() < 2) {
      throw new CorruptStoreException(file, "expected at least 2 members, actual "
          + (manifest.members() == null ? 0 : manifest.members().size()));
    }
    for (Member member : manifest.members()) {
      if (member.folder() == null || !member.folder().matches("member-[0-9]+")) {
        throw new CorruptStoreException(file, "expected member folders named member-<number>, actual "
            + member.folder());
      }
    }
    return manifest;
  }

  /**
   * Opens every model a directory holds for forecasting {@code history}: its members when it holds a combination,
   * else the one model (a member without a name).
   */
  public static Opened open(Path dir, SalesHistory history) throws IOException {
    if (!isCombination(dir)) {
      ModelSet models = ModelDirectory.open(dir, history);
      return new Opened(List.of(new Member(null, ".")), List.of(models),
          List.of(ModelDirectory.readManifest(dir)));
    }
    Manifest manifest = readManifest(dir);
    List<ModelSet> opened = new ArrayList<>();
    List<ModelManifest> manifests = new ArrayList<>();
    try {
      for (Member member : manifest.members()) {
        Path memberDir = dir.resolve(member.folder());
        manifests.add(ModelDirectory.readManifest(memberDir));
        opened.add(ModelDirectory.open(memberDir, history));
      }
    } catch (IOException | RuntimeException | Error e) {
      opened.forEach(ModelSet::close);
      throw e;
    }
    return new Opened(manifest.members(), opened, manifests);
  }

  /** The models of one directory, open for forecasting; closing closes every member. */
  public static final class Opened implements AutoCloseable {
    private final List<Member> members;
    private final List<ModelSet> models;
    private final List<ModelManifest> manifests;

    Opened(List<Member> members, List<ModelSet> models, List<ModelManifest> manifests) {
      this.members = List.copyOf(members);
      this.models = List.copyOf(models);
      this.manifests = List.copyOf(manifests);
    }

    /** One per member, in order; a single model's name is null. */
    public List<Member> members() { return members; }

    public List<ModelSet> models() { return models; }

    public List<ModelManifest> manifests() { return manifests; }

    /** Whether the directory held several members. */
    public boolean combined() { return models.size() > 1; }

    /** Every member's partitions, in member order (the report's training section). */
    public List<PartitionReport> partitions() {
      List<PartitionReport> all = new ArrayList<>();
      manifests.forEach(m -> all.addAll(m.partitions()));
      return all;
    }

    @Override
    public void close() {
      models.forEach(ModelSet::close);
    }
  }

  /**
   * Writes a combination: members are saved one after another into sub-folders of a temporary sibling, and
   * {@link #finish} renames the whole folder into place, so a failed run never damages an existing model directory.
   */
  public static final class Writer implements AutoCloseable {
    private final Path dir;
    private final Path temp;
    private final List<Member> members = new ArrayList<>();
    private boolean finished;

    private Writer(Path dir, Path temp) {
      this.dir = dir;
      this.temp = temp;
    }

    /** Checks the target (a new or empty folder, or a model directory lagmill wrote) and starts the temporary one. */
    public static Writer begin(Path dir) throws IOException {
      ModelDirectory.checkTarget(dir);
      return new Writer(dir, StoreDirectories.createTempSibling(dir));
    }

    /** Saves the next member's models into its sub-folder. */
    public ModelManifest save(String name, ModelSet models, SalesHistory history, TrainingPlan plan,
        String storeFingerprint) throws IOException {
      Member member = new Member(name, "member-" + (members.size() + 1));
      ModelManifest manifest = ModelDirectory.save(models, temp.resolve(member.folder()), history, plan,
          storeFingerprint);
      members.add(member);
      return manifest;
    }

    /** Writes {@code combination.json} and renames the folder into place. */
    public void finish() throws IOException {
      if (members.size() < 2) {
        throw new IllegalStateException("a combination needs at least 2 members, got " + members.size());
      }
      Files.write(temp.resolve(FILE_NAME), SealedJson.seal(ModelDirectory.JSON.writeValueAsBytes(
          new Manifest(FORMAT_VERSION_CURRENT, members))));
      StoreDirectories.publish(temp, dir);
      finished = true;
    }

    /** Removes the temporary folder unless {@link #finish} published it. */
    @Override
    public void close() throws IOException {
      if (!finished) {
        finished = true;
        StoreDirectories.deleteRecursively(temp);
      }
    }
  }
}
