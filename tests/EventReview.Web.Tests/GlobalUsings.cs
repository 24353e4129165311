// CheckRecords (the JSON form, tool version and "same inputs" rule of every check) moved from the web app to Core.Evidence.
global using EventReview.Core.Evidence;
