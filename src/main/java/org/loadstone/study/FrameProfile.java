package org.loadstone.study;

import org.loadstone.archive.SafeNames;

import com.fasterxml.jackson.annotation.JsonProperty;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.io.IOException;
import java.nio.file.Path;
import com.fasterxml.jackson.core.JsonProcessingException;
import org.loadstone.files.FileExistsException;
import org.loadstone.files.FilePublisher;
import org.loadstone.units.LoadstoneException;

/**
 * A load frame's own stiffness, measured once from a run against a rigid block, kept in a small
 * JSON file so later runs can be corrected for frame compliance.
 *
 * @param id the frame's name
 * @param description free text
 * @param frameStiffness_N_per_mm the slope of force against crosshead travel on a rigid block
 * @param measuredFromRun the rigid-block run it came from
 * @param measuredAt ISO date-time
 */
public record FrameProfile(
    @JsonProperty("id") String id,
    @JsonProperty("description") String description,
    @JsonProperty("frame_stiffness_N_per_mm") double frameStiffness_N_per_mm,
    @JsonProperty("measured_from_run") String measuredFromRun,
    @JsonProperty("measured_at") String measuredAt) {

  public FrameProfile {
    if (id == null || id.isBlank()) {
      throw new LoadstoneException("field 'id' of the frame profile is missing: give the frame a name");
    }
    if (!(Double.isFinite(frameStiffness_N_per_mm) && frameStiffness_N_per_mm > 0)) {
      throw new LoadstoneException("field 'frame_stiffness_N_per_mm' of frame profile " + id
          + " must be a positive number, was " + frameStiffness_N_per_mm);
    }
  }

  private static final ObjectMapper JSON =
      new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

  /** @throws LoadstoneException naming the file and the fault */
  public static FrameProfile read(Path file) {
    try {
      return JSON.readValue(file.toFile(), FrameProfile.class);
    } catch (com.fasterxml.jackson.databind.JsonMappingException e) {
      Throwable c = e.getCause() instanceof LoadstoneException ? e.getCause() : e;
      throw new LoadstoneException("frame profile " + file + ": " + c.getMessage(), e);
    } catch (IOException e) {
      throw new LoadstoneException("frame profile " + file + " cannot be read: " + e.getMessage(),
          e);
    }
  }

  /**
   * Writes {@code <dir>/<id>.json} through {@link FilePublisher}; never overwrites.
   *
   * @return the file
   * @throws LoadstoneException when the file exists or cannot be written, naming it and the fix
   */
  public Path save(Path dir) {
    Path file = dir.resolve(SafeNames.forFile(id) + ".json");
    try {
      return FilePublisher.publish(file, "frame profile", JSON.writeValueAsBytes(this));
    } catch (FileExistsException e) {
      throw new LoadstoneException("frame profile " + file + " already exists and profiles are"
          + " never overwritten: give the frame another name");
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("cannot serialise frame profile " + id, e);
    }
  }
}
