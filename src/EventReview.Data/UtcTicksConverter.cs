using Microsoft.EntityFrameworkCore.Storage.ValueConversion;

namespace EventReview.Data;

/// <summary>Stores a <see cref="DateTimeOffset"/> as its exact UTC ticks (100 ns) and reads it back with offset zero.</summary>
public sealed class UtcTicksConverter() : ValueConverter<DateTimeOffset, long>(v => v.UtcTicks, v => new DateTimeOffset(v, TimeSpan.Zero));
