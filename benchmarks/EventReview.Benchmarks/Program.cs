using BenchmarkDotNet.Running;

// Run with: dotnet run -c Release --project benchmarks/EventReview.Benchmarks -- --filter '*'
// One benchmark class per file in this folder; BenchmarkSwitcher finds them all.
BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);

/// <summary>Entry point marker.</summary>
public partial class Program;
